import { Link, useNavigate } from 'react-router-dom';
import { Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { SignUpForm } from '../../features/auth/components/sign-up-form';

export function SignUpRoute() {
  const navigate = useNavigate();
  return (
    <Panel level={1} title="Create your account">
      <p className="mb-4 text-ink-soft">
        With an account you can ask for estimates, follow your piece through the shop and pay online.
      </p>
      <SignUpForm onDone={() => navigate(`${paths.projects.getHref()}?welcome=1`)} />
      <p className="mt-4">
        Already have one?{' '}
        <Link to={paths.signIn.getHref()} className="text-wood underline">
          Sign in
        </Link>
      </p>
    </Panel>
  );
}
