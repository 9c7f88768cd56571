import { useParams } from 'react-router-dom';
import { RoleGate } from '../../components/layout';
import { TravellerPage } from '../../features/board/components/traveller';
import { canSeeBoard } from '../../lib/policies';

export function JobRoute() {
  const { id = '' } = useParams();
  return (
    <RoleGate allow={canSeeBoard}>
      <TravellerPage id={id} />
    </RoleGate>
  );
}
