import { RoleGate } from '../../components/layout';
import { PriceBookPage } from '../../features/price-book/components/price-book-page';
import { canEditPriceBook } from '../../lib/policies';

export function PriceBookRoute() {
  return (
    <RoleGate allow={canEditPriceBook}>
      <PriceBookPage />
    </RoleGate>
  );
}
