import { Link, useNavigate } from 'react-router-dom';
import { Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { SignInForm } from '@benchwright/ui/auth';

export function SignInRoute() {
  const navigate = useNavigate();
  return (
    <Panel level={1} title="Sign in to the shop">
      <SignInForm onDone={() => navigate(paths.home.getHref())} />
      <p className="mt-4">
        <Link to={paths.forgotPassword.getHref()} className="text-wood underline">
          Forgot your password?
        </Link>
      </p>
    </Panel>
  );
}
