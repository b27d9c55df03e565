import { KARPLUS_CAUTION, type KarplusRelation } from './karplus';

/** One range of dihedral angles whose J lies within the band J ± kσ. */
export interface AngleInterval {
  /** Degrees; fromDeg < toDeg. Angles lie in −180..180, except that an interval running through ±180° ends above 180. */
  fromDeg: number;
  toDeg: number;
  /** Angles inside the interval where the relation gives exactly the measured J (empty when it only comes within kσ). */
  exactDeg: number[];
}

export interface KarplusInverse {
  relation: string;
  source: string;
  jHz: number;
  sdHz: number;
  k: number;
  intervals: AngleInterval[];
  /** Always present: the relation is an aid, not a proof (see KARPLUS_CAUTION). */
  caution: string;
  /** Extra notes, e.g. that J lies outside the relation's range. */
  notes: string[];
}

export interface InverseOptions {
  /** Width of the band in standard deviations (default 2). */
  k?: number;
  /** Grid step, degrees (default 0.1); every crossing is then refined by bisection to 1e-9°. */
  stepDeg?: number;
}

const BISECT_TOL_DEG = 1e-9;

/** Bisection for a sign change of f between a and b (f(a) and f(b) of opposite sign or zero). */
function bisect(f: (x: number) => number, a: number, b: number): number {
  let fa = f(a);
  if (fa === 0) return a;
  if (f(b) === 0) return b;
  while (Math.abs(b - a) > BISECT_TOL_DEG) {
    const m = (a + b) / 2;
    const fm = f(m);
    if (fm === 0) return m;
    if (Math.sign(fm) === Math.sign(fa)) {
      a = m;
      fa = fm;
    } else {
      b = m;
    }
  }
  return (a + b) / 2;
}

/**
 * All dihedral angles φ in −180..180° with |J(φ) − jHz| ≤ k·sdHz: the band is scanned on a fine
 * grid, each edge and each exact solution refined by bisection. A run that touches both −180° and
 * 180° is one interval through 180° (fromDeg > 0, toDeg > 180). Features narrower than the grid
 * step can be missed (at the default 0.1° they are far below any meaningful angle precision).
 */
export function anglesForJ(relation: KarplusRelation, jHz: number, sdHz: number, opts: InverseOptions = {}): KarplusInverse {
  const k = opts.k ?? 2;
  const step = opts.stepDeg ?? 0.1;
  if (!Number.isFinite(jHz)) throw new RangeError(`J must be a finite number of Hz, got ${jHz}`);
  if (!(sdHz >= 0) || !Number.isFinite(sdHz)) throw new RangeError(`sd must be a finite number of Hz >= 0, got ${sdHz}`);
  if (!(k >= 0) || !Number.isFinite(k)) throw new RangeError(`k must be a finite number >= 0, got ${k}`);
  if (!(step > 0 && step <= 5)) throw new RangeError(`stepDeg must be in (0, 5], got ${step}`);
  const band = k * sdHz;
  const diff = (phi: number): number => relation.j(phi) - jHz;
  // Inside the band when |diff| <= band; with band 0 the "band" is the exact solutions only.
  const edge = (phi: number): number => Math.abs(diff(phi)) - band;
  const n = Math.ceil(360 / step);
  const grid = Array.from({ length: n + 1 }, (_, i) => -180 + (360 * i) / n);

  const runs: AngleInterval[] = [];
  let open: AngleInterval | null = null;
  for (let i = 0; i < grid.length; i++) {
    const phi = grid[i] ?? 0;
    const prev = grid[i - 1];
    const inside = edge(phi) <= 0;
    if (inside && !open) {
      open = { fromDeg: prev === undefined ? phi : bisect(edge, prev, phi), toDeg: phi, exactDeg: [] };
    } else if (!inside && open && prev !== undefined) {
      open.toDeg = bisect(edge, prev, phi);
      runs.push(open);
      open = null;
    }
    if (prev !== undefined && Math.sign(diff(prev)) !== Math.sign(diff(phi)) && diff(phi) !== 0) {
      const root = bisect(diff, prev, phi);
      const closed = runs[runs.length - 1];
      // A band narrower than the grid step can hold a root between two outside points: keep it as a point.
      if (open) open.exactDeg.push(root);
      else if (closed && closed.toDeg >= prev) closed.exactDeg.push(root);
      else runs.push({ fromDeg: root, toDeg: root, exactDeg: [root] });
    }
  }
  if (open) {
    open.toDeg = 180;
    runs.push(open);
  }
  return inverseResult(relation, jHz, sdHz, k, mergeWrap(runs));
}

function mergeWrap(runs: AngleInterval[]): AngleInterval[] {
  const first = runs[0];
  const last = runs[runs.length - 1];
  if (runs.length < 2 || !first || !last || first.fromDeg > -180 || last.toDeg < 180) return runs;
  const merged: AngleInterval = {
    fromDeg: last.fromDeg,
    toDeg: first.toDeg + 360,
    exactDeg: [...last.exactDeg, ...first.exactDeg.map((x) => x + 360)],
  };
  return [...runs.slice(1, -1), merged];
}

function inverseResult(relation: KarplusRelation, jHz: number, sdHz: number, k: number, intervals: AngleInterval[]): KarplusInverse {
  const notes: string[] = [];
  if (intervals.length === 0) {
    notes.push(`No dihedral angle gives ${jHz.toFixed(1)} ± ${(k * sdHz).toFixed(1)} Hz with ${relation.name}: the value lies outside the relation's range.`);
  }
  if (intervals.length > 1) notes.push(`${intervals.length} separate ranges of angles fit; the measurement alone cannot choose between them.`);
  return { relation: relation.name, source: relation.source, jHz, sdHz, k, intervals, caution: KARPLUS_CAUTION, notes };
}
