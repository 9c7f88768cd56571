import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { safeRedirect, SignInForm } from '@benchwright/ui/auth';

export function SignInRoute() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const redirect = params.get('redirect');
  return (
    <Panel level={1} title="Sign in">
      <SignInForm onDone={() => navigate(safeRedirect(redirect, paths.projects.getHref()))} />
      <p className="mt-4">
        <Link to={paths.forgotPassword.getHref()} className="text-wood underline">
          Forgot your password?
        </Link>{' '}
        · New here?{' '}
        <Link to={paths.signUp.getHref()} className="text-wood underline">
          Create an account
        </Link>
      </p>
    </Panel>
  );
}
