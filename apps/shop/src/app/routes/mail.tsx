import { Panel } from '@benchwright/ui';
import { RoleGate } from '../../components/layout';
import { FailedMailList } from '../../features/mail/components/failed-mail-list';
import { canSeeMail } from '../../lib/policies';

export function MailRoute() {
  return (
    <RoleGate allow={canSeeMail}>
      <Panel level={1} title="Failed e-mails">
        <FailedMailList />
      </Panel>
    </RoleGate>
  );
}
