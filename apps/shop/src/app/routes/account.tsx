import { useNavigate, useSearchParams } from 'react-router-dom';
import { Panel } from '@benchwright/ui';
import { AccountPage, ConfirmEmailChange } from '@benchwright/ui/account';
import { paths } from '../../config/paths';

export function AccountRoute() {
  const navigate = useNavigate();
  return <AccountPage onSignedOut={() => navigate(paths.signIn.getHref())} />;
}

export function ConfirmEmailRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <h1 className="mb-6 text-2xl font-bold">Confirm your new e-mail</h1>
      <Panel>
        <ConfirmEmailChange token={params.get('token') ?? ''} />
      </Panel>
    </>
  );
}
