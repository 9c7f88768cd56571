import { Notice } from '@benchwright/ui';
import { RoleGate } from '../../components/layout';
import { PriceBookPage } from '../../features/price-book/components/price-book-page';
import { useSettings } from '../../features/settings/api/settings';
import { canEditPriceBook } from '../../lib/policies';

/** The price book reads in the shop's units and names its stages as the board does: both from the settings. */
function PriceBookInShopUnits() {
  const settings = useSettings();
  if (settings.isPending) return <p>Loading the price book…</p>;
  if (settings.isError) return <Notice tone="error">{settings.error.message}</Notice>;
  const { values, stages } = settings.data;
  return (
    <PriceBookPage cu={{ units: values.units, stageLabels: Object.fromEntries(stages.map((s) => [s.key, s.label])) }} />
  );
}

export function PriceBookRoute() {
  return (
    <RoleGate allow={canEditPriceBook}>
      <PriceBookInShopUnits />
    </RoleGate>
  );
}
