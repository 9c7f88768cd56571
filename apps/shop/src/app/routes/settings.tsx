import { RoleGate } from '../../components/layout';
import { SettingsForm } from '../../features/settings/components/settings-form';
import { canChangeSettings } from '../../lib/policies';

export function SettingsRoute() {
  return (
    <RoleGate allow={canChangeSettings}>
      <h1 className="mb-4 text-2xl font-bold">Settings</h1>
      <SettingsForm />
    </RoleGate>
  );
}
