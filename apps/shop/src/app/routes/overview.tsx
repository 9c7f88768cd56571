import { RoleGate } from '../../components/layout';
import { OverviewPage } from '../../features/overview/components/overview';
import { HoursFeedback } from '../../features/overview/components/hours-feedback';
import { canSeeOverview } from '../../lib/policies';

export function OverviewRoute() {
  return (
    <RoleGate allow={canSeeOverview}>
      <h1 className="mb-4 text-2xl font-bold">Overview</h1>
      <OverviewPage />
      <HoursFeedback />
    </RoleGate>
  );
}
