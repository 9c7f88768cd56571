import { Panel } from '@benchwright/ui';
import { ForgotPasswordForm } from '@benchwright/ui/auth';

export function ForgotPasswordRoute() {
  return (
    <Panel level={1} title="Forgot your password?">
      <p className="mb-4 text-ink-soft">
        Give the e-mail you signed up with and we will send a link to choose a new password.
      </p>
      <ForgotPasswordForm />
    </Panel>
  );
}
