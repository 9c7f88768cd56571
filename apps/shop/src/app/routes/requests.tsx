import { Panel } from '@benchwright/ui';
import { ProjectTable } from '../../features/projects/components/project-table';
import { RoleGate } from '../../components/layout';
import { canSeeRequests } from '../../lib/policies';
import { paths } from '../../config/paths';

export function RequestsRoute() {
  return (
    <RoleGate allow={canSeeRequests}>
      <Panel level={1} title="Requests and estimates">
        <ProjectTable empty="No requests yet." linkTo={paths.request.getHref} />
      </Panel>
    </RoleGate>
  );
}
