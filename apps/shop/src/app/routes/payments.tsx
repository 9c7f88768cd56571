import { Panel } from '@benchwright/ui';
import { RoleGate } from '../../components/layout';
import { PaymentsTable } from '../../features/payments/components/payments-table';
import { canSeePayments } from '../../lib/policies';

export function PaymentsRoute() {
  return (
    <RoleGate allow={canSeePayments}>
      <Panel level={1} title="Payments and refunds">
        <PaymentsTable />
      </Panel>
    </RoleGate>
  );
}
