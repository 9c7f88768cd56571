import { useNavigate, useSearchParams } from 'react-router-dom';
import { Notice, Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { ForgotPasswordForm, ResetPasswordForm } from '@benchwright/ui/auth';

export function ForgotPasswordRoute() {
  return (
    <Panel level={1} title="Forgot your password?">
      <ForgotPasswordForm />
    </Panel>
  );
}

export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const token = params.get('token') ?? '';
  return (
    <Panel level={1} title="Choose a new password">
      {token ? (
        <ResetPasswordForm token={token} onDone={() => navigate(paths.home.getHref())} />
      ) : (
        <Notice tone="error">This link has no reset code.</Notice>
      )}
    </Panel>
  );
}
