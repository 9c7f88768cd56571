import { Panel } from '@benchwright/ui';
import { ProjectTable } from '../../features/projects/components/project-table';
import { RoleGate } from '../../components/layout';
import { canSeeRequests } from '../../lib/policies';

export function RequestsRoute() {
  return (
    <RoleGate allow={canSeeRequests}>
      <Panel title="Requests and estimates">
        <ProjectTable inShop={false} empty="No requests yet." />
      </Panel>
    </RoleGate>
  );
}
