/**
 * Cuts an L x W sheet at random with guillotine cuts into pieces no bigger
 * than `max` on a side: a layout known to exist, for testing and tuning the
 * exact search (tests and bench only).
 */
export function guillotinePieces(
  L: number,
  W: number,
  max: number,
  rand: () => number,
  stop = 0.6,
): [number, number][] {
  const out: [number, number][] = [];
  const cut = (l: number, w: number) => {
    if (l <= max && w <= max && (rand() < stop || l * w <= 2)) return void out.push([l, w]);
    let along = l > max && w > max ? rand() < 0.5 : l > max;
    if (along && l < 2) along = false;
    if (!along && w < 2) along = true;
    const d = along ? l : w;
    const c = 1 + Math.floor(rand() * (d - 1));
    if (along) {
      cut(c, w);
      cut(l - c, w);
    } else {
      cut(l, c);
      cut(l, w - c);
    }
  };
  cut(L, W);
  return out;
}

/** the pieces counted by size, as the exact search takes them */
export function piecesByKind(
  pieces: [number, number][],
  canRotate: boolean,
): { l: number; w: number; canRotate: boolean; count: number }[] {
  const m = new Map<string, { l: number; w: number; canRotate: boolean; count: number }>();
  for (const [l, w] of pieces) {
    const kind = m.get(`${l},${w}`);
    if (kind) kind.count++;
    else m.set(`${l},${w}`, { l, w, canRotate, count: 1 });
  }
  return [...m.values()];
}
