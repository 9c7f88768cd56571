import { Panel } from '@benchwright/ui';
import { ProjectTable } from '../../features/projects/components/project-table';
import { RoleGate } from '../../components/layout';
import { canSeeBoard } from '../../lib/policies';

export function BoardRoute() {
  return (
    <RoleGate allow={canSeeBoard}>
      <Panel title="Production board">
        <ProjectTable inShop empty="No jobs in the shop yet. A job arrives here once its client has paid the deposit." />
      </Panel>
    </RoleGate>
  );
}
