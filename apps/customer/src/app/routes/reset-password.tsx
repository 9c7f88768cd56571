import { useNavigate, useSearchParams } from 'react-router-dom';
import { Notice, Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { ResetPasswordForm } from '@benchwright/ui/auth';

export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const token = params.get('token') ?? '';
  return (
    <Panel level={1} title="Choose a new password">
      {token ? (
        <ResetPasswordForm token={token} onDone={() => navigate(paths.projects.getHref())} />
      ) : (
        <Notice tone="error">This link has no reset code. Open the link from the e-mail again.</Notice>
      )}
    </Panel>
  );
}
