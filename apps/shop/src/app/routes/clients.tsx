import { useNavigate, useParams } from 'react-router-dom';
import { Panel } from '@benchwright/ui';
import { RoleGate } from '../../components/layout';
import { paths } from '../../config/paths';
import { AddClientForm } from '../../features/clients/components/add-client-form';
import { ClientDetails } from '../../features/clients/components/client-details';
import { ClientsTable } from '../../features/clients/components/clients-table';
import { StartProjectForm } from '../../features/clients/components/start-project-form';
import { canSeeClients } from '../../lib/policies';

export function ClientsRoute() {
  const navigate = useNavigate();
  return (
    <RoleGate allow={canSeeClients}>
      <Panel title="Clients" level={1}>
        <ClientsTable linkTo={paths.client.getHref} />
      </Panel>
      <Panel title="Add a client">
        <p className="mb-4 text-ink-soft">Someone who called or came in: they get a mail to claim their account.</p>
        <AddClientForm onAdded={(id) => navigate(paths.client.getHref(id))} />
      </Panel>
    </RoleGate>
  );
}

export function ClientRoute() {
  const { id = '' } = useParams();
  const navigate = useNavigate();
  return (
    <RoleGate allow={canSeeClients}>
      <Panel>
        <ClientDetails id={id} projectHref={paths.request.getHref} />
      </Panel>
      <Panel title="Start a project">
        <StartProjectForm clientId={id} onStarted={(pid) => navigate(paths.request.getHref(pid))} />
      </Panel>
    </RoleGate>
  );
}
