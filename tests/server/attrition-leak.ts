/**
 * An independent check that an attrition table gives no small cell away: every way of filling its
 * hidden cells that agrees with the shown ones is enumerated (the registry total must be shown), and
 * each "<k" cell must be able to take at least two values. A "hidden" (withheld) cell is known to be ≥ k: zeros are never withheld.
 */
type Cell = number | string;

export function smallCellValues(rows: { excluded: Cell; remaining: Cell }[], k: number): Map<string, Set<number>> {
  const total = rows[0]?.remaining;
  if (typeof total !== 'number') throw new Error('the check needs the registry total to be shown');
  const fits = (cell: Cell, v: number) =>
    typeof cell === 'number' ? cell === v : cell === 'hidden' ? v >= k : v >= 1 && v < k;
  const seen = new Map<string, Set<number>>();
  const note = (key: string, cell: Cell, v: number) => {
    if (typeof cell === 'string' && cell !== 'hidden') seen.set(key, (seen.get(key) ?? new Set()).add(v));
  };
  const chosen: number[] = [];
  const walk = (i: number, left: number): void => {
    if (i === rows.length) {
      let r = total;
      for (let j = 1; j < rows.length; j++) {
        const e = chosen[j - 1] ?? 0;
        r -= e;
        note(`excluded ${j}`, rows[j]!.excluded, e);
        note(`remaining ${j}`, rows[j]!.remaining, r);
      }
      return;
    }
    const row = rows[i]!;
    const options = typeof row.excluded === 'number' ? [row.excluded] : Array.from({ length: left + 1 }, (_, v) => v);
    for (const e of options) {
      if (e > left || !fits(row.excluded, e) || !fits(row.remaining, left - e)) continue;
      chosen[i - 1] = e;
      walk(i + 1, left - e);
    }
  };
  walk(1, total);
  return seen;
}
