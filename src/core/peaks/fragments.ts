import type { Extremum } from './types';

interface Summary {
  readonly rowMin: number;
  readonly rowMax: number;
  readonly colMin: number;
  readonly colMax: number;
  readonly row: number;
}

/**
 * Rejoins the two halves of a multiplet split along F1. F1 lines are broad (short acquisition
 * time), so in F1 a multiplet often shows only its two outer lobes of opposite sign; at low
 * signal-to-noise the inner ones fall below the level and the outer ones can lie further apart
 * than the link distance. Such a half has all its extrema within one F1 point (one "row" of lobes)
 * - a whole cross peak is antiphase in F1 and always spans more - so two halves are joined when:
 * both are one row tall, their F2 ranges overlap or lie within `reach2` points, their rows are at
 * most `reach1` points apart, and no two of their extrema at the same F2 position (within
 * ALIGNED points) have the same sign (in one multiplet the two F1 halves are of opposite sign).
 * Two distinct cross peaks each keep both signs along F1 and are never joined by this rule, unless
 * both lost one F1 half (weak peaks) and lie within `reach1` rows of each other in the same columns.
 */
export function joinHalves(extrema: readonly Extremum[], groups: number[][], reach1: number, reach2: number): number[][] {
  const sums = groups.map((g) => summarise(extrema, g));
  const pairs: { a: number; b: number; gap: number }[] = [];
  for (let a = 0; a < groups.length; a++) {
    for (let b = a + 1; b < groups.length; b++) {
      const sa = sums[a];
      const sb = sums[b];
      if (!sa || !sb || !isHalf(sa) || !isHalf(sb)) continue;
      const gap = Math.abs(sa.row - sb.row);
      if (gap > reach1 || sa.colMax + reach2 < sb.colMin || sb.colMax + reach2 < sa.colMin) continue;
      if (sameSignAligned(extrema, groups[a] ?? [], groups[b] ?? [])) continue;
      pairs.push({ a, b, gap });
    }
  }
  pairs.sort((x, y) => x.gap - y.gap || x.a - y.a || x.b - y.b);
  const used = new Set<number>();
  const out = groups.map((g) => [...g]);
  for (const { a, b } of pairs) {
    if (used.has(a) || used.has(b)) continue;
    used.add(a);
    used.add(b);
    out[a] = [...(out[a] ?? []), ...(out[b] ?? [])].sort((x, y) => x - y);
    out[b] = [];
  }
  return out.filter((g) => g.length > 0);
}

function isHalf(s: Summary): boolean {
  return s.rowMax - s.rowMin < 1;
}

function summarise(extrema: readonly Extremum[], group: readonly number[]): Summary | undefined {
  const list = group.map((i) => extrema[i]).filter((e): e is Extremum => e !== undefined);
  if (list.length === 0) return undefined;
  const rows = list.map((e) => e.row);
  const cols = list.map((e) => e.col);
  const row = rows.reduce((s, r) => s + r, 0) / rows.length;
  return { rowMin: Math.min(...rows), rowMax: Math.max(...rows), colMin: Math.min(...cols), colMax: Math.max(...cols), row };
}

/** Two extrema of one group each closer than this in F2, points, count as the same F2 position. */
const ALIGNED = 1.5;

/** True when some extremum of a and some of b sit at the same F2 position with the same sign. */
function sameSignAligned(extrema: readonly Extremum[], a: readonly number[], b: readonly number[]): boolean {
  for (const i of a) {
    for (const j of b) {
      const ea = extrema[i];
      const eb = extrema[j];
      if (ea && eb && ea.sign === eb.sign && Math.abs(ea.col - eb.col) <= ALIGNED) return true;
    }
  }
  return false;
}
