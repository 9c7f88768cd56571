import { RoleGate } from '../../components/layout';
import { Board } from '../../features/board/components/board';
import { canSeeBoard } from '../../lib/policies';

export function BoardRoute() {
  return (
    <RoleGate allow={canSeeBoard}>
      <h1 className="mb-4 text-2xl font-bold">Production board</h1>
      <Board />
    </RoleGate>
  );
}
