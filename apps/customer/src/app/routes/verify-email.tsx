import { useEffect, useRef } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Notice, Panel } from '@benchwright/ui';
import { paths } from '../../config/paths';
import { useVerifyEmail } from '../../features/auth/api/verify-email';

export function VerifyEmailRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const verify = useVerifyEmail();
  const sent = useRef(false);
  useEffect(() => {
    if (token && !sent.current) {
      sent.current = true;
      verify.mutate(token);
    }
  }, [token, verify]);
  return (
    <Panel level={1} title="Confirm your e-mail">
      {!token ? (
        <Notice tone="error">This link has no confirmation code. Open the link from the e-mail again.</Notice>
      ) : null}
      {verify.isPending ? <p>Confirming…</p> : null}
      {verify.isSuccess ? (
        <Notice tone="ok">Thank you: your e-mail address {verify.data.user.email} is confirmed.</Notice>
      ) : null}
      {verify.isError ? <Notice tone="error">{verify.error.message}</Notice> : null}
      <Link to={paths.projects.getHref()} className="text-wood underline">
        Go to my projects
      </Link>
    </Panel>
  );
}
