import { Panel } from '@benchwright/ui';
import { RoleGate } from '../../components/layout';
import { InviteForm } from '../../features/team/components/invite-form';
import { TeamList } from '../../features/team/components/team-list';
import { canInviteBuilders } from '../../lib/policies';

export function TeamRoute() {
  return (
    <RoleGate allow={canInviteBuilders}>
      <Panel level={1} title="The team">
        <TeamList />
      </Panel>
      <Panel title="Invite a builder">
        <p className="mb-4 text-ink-soft">
          Builders see the production board, travelers and hour logs; never prices or payments.
        </p>
        <InviteForm />
      </Panel>
    </RoleGate>
  );
}
