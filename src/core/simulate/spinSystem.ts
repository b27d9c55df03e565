/**
 * First-order (weakly coupled) ¹H spin systems: chemical shifts, linewidths, couplings, and the
 * multiplet line lists they give. Each spin's multiplet is its shift split by every coupling; n
 * equivalent partners give the binomial pattern (Pascal's triangle; any NMR text).
 */
export interface Spin {
  readonly label: string;
  readonly ppm: number;
  /** Lorentzian full width at half height, Hz (natural T2 line: R2 = pi * width). */
  readonly linewidthHz: number;
  /** Number of equivalent protons (3 for a CH3); default 1. */
  readonly count?: number;
}

export interface Coupling {
  readonly a: string;
  readonly b: string;
  /** Signed coupling constant, Hz. */
  readonly jHz: number;
}

export interface SpinSystem {
  readonly observeMhz: number;
  readonly spins: readonly Spin[];
  readonly couplings: readonly Coupling[];
}

/** One line of a multiplet: offset from the multiplet centre (Hz) and signed amplitude. */
export interface Line {
  readonly offsetHz: number;
  readonly amplitude: number;
}

/** Throws a RangeError naming the field at fault when the system is not usable. */
export function validateSpinSystem(s: SpinSystem): void {
  if (!(s.observeMhz > 0) || !Number.isFinite(s.observeMhz)) {
    throw new RangeError(`spin system: observeMhz must be a positive number, got ${s.observeMhz}`);
  }
  if (s.spins.length === 0) throw new RangeError('spin system: spins is empty');
  const seen = new Set<string>();
  s.spins.forEach((spin, i) => {
    const where = `spin system: spins[${i}] (${JSON.stringify(spin.label)})`;
    if (typeof spin.label !== 'string' || spin.label.trim() === '') throw new RangeError(`spin system: spins[${i}].label is empty`);
    if (seen.has(spin.label)) throw new RangeError(`${where}: label is used twice`);
    seen.add(spin.label);
    if (!Number.isFinite(spin.ppm)) throw new RangeError(`${where}.ppm must be finite, got ${spin.ppm}`);
    if (!(spin.linewidthHz > 0) || !Number.isFinite(spin.linewidthHz)) {
      throw new RangeError(`${where}.linewidthHz must be positive, got ${spin.linewidthHz}`);
    }
    const n = spin.count ?? 1;
    if (!Number.isInteger(n) || n < 1) throw new RangeError(`${where}.count must be a positive integer, got ${n}`);
  });
  const pairs = new Set<string>();
  s.couplings.forEach((c, i) => {
    const where = `spin system: couplings[${i}] (${c.a}, ${c.b})`;
    if (!seen.has(c.a)) throw new RangeError(`${where}: unknown spin label ${JSON.stringify(c.a)}`);
    if (!seen.has(c.b)) throw new RangeError(`${where}: unknown spin label ${JSON.stringify(c.b)}`);
    if (c.a === c.b) throw new RangeError(`${where}: a spin cannot couple to itself (J on the diagonal)`);
    if (!Number.isFinite(c.jHz)) throw new RangeError(`${where}.jHz must be finite, got ${c.jHz}`);
    const key = [c.a, c.b].sort().join('\u0000');
    if (pairs.has(key)) throw new RangeError(`${where}: this pair is given twice`);
    pairs.add(key);
  });
}

export function findSpin(s: SpinSystem, label: string): Spin {
  const spin = s.spins.find((x) => x.label === label);
  if (!spin) throw new RangeError(`spin system: unknown spin label ${JSON.stringify(label)}`);
  return spin;
}

export function spinCount(spin: Spin): number {
  return spin.count ?? 1;
}

/** Signed J between two spins, 0 when they are not coupled. */
export function couplingBetween(s: SpinSystem, a: string, b: string): number {
  findSpin(s, a);
  findSpin(s, b);
  const c = s.couplings.find((x) => (x.a === a && x.b === b) || (x.a === b && x.b === a));
  return c ? c.jHz : 0;
}

/** Partners of a spin with non-zero J: the other label, J and the partner's proton count. */
export function partnersOf(s: SpinSystem, label: string): { label: string; jHz: number; count: number }[] {
  const out: { label: string; jHz: number; count: number }[] = [];
  for (const c of s.couplings) {
    if (c.jHz === 0) continue;
    const other = c.a === label ? c.b : c.b === label ? c.a : undefined;
    if (other !== undefined) out.push({ label: other, jHz: c.jHz, count: spinCount(findSpin(s, other)) });
  }
  return out;
}

/**
 * |Δν| / |J| for two spins (Δν in Hz at the system's observe frequency); first-order analysis
 * is usually trusted above about 10 (common practice). Infinity when the spins are not coupled.
 */
export function strongCouplingRatio(s: SpinSystem, a: string, b: string): number {
  const dnu = Math.abs(findSpin(s, a).ppm - findSpin(s, b).ppm) * s.observeMhz;
  const j = Math.abs(couplingBetween(s, a, b));
  return j === 0 ? Number.POSITIVE_INFINITY : dnu / j;
}

/** Tolerance for merging coinciding lines, Hz. */
const MERGE_HZ = 1e-9;

/** Convolve a line list with a pair of lines at ±J/2 (in-phase: +½, +½; antiphase: +½ at +J/2, −½ at −J/2). */
export function splitLines(lines: readonly Line[], jHz: number, antiphase: boolean): Line[] {
  const out: Line[] = [];
  for (const l of lines) {
    out.push({ offsetHz: l.offsetHz + jHz / 2, amplitude: l.amplitude / 2 });
    out.push({ offsetHz: l.offsetHz - jHz / 2, amplitude: (antiphase ? -l.amplitude : l.amplitude) / 2 });
  }
  return mergeLines(out);
}

/** Sum lines at the same position and sort by offset, highest first. */
export function mergeLines(lines: readonly Line[]): Line[] {
  const sorted = [...lines].sort((x, y) => y.offsetHz - x.offsetHz);
  const out: Line[] = [];
  for (const l of sorted) {
    const last = out[out.length - 1];
    if (last && Math.abs(last.offsetHz - l.offsetHz) < MERGE_HZ) {
      out[out.length - 1] = { offsetHz: last.offsetHz, amplitude: last.amplitude + l.amplitude };
    } else {
      out.push(l);
    }
  }
  return out.filter((l) => l.amplitude !== 0);
}

/**
 * A multiplet built from a list of splittings: `inPhase` J values (one entry per coupled proton)
 * and optionally one `antiphase` J. Total in-phase intensity is 1 (one proton).
 */
export function multipletLines(inPhase: readonly number[], antiphase?: number): Line[] {
  let lines: Line[] = [{ offsetHz: 0, amplitude: 1 }];
  if (antiphase !== undefined) lines = splitLines(lines, antiphase, true);
  for (const j of inPhase) lines = splitLines(lines, j, false);
  return lines;
}

/** The in-phase splittings a spin feels, one entry per coupled proton, optionally leaving out one proton of one partner. */
export function splittingsOf(s: SpinSystem, label: string, activePartner?: string): number[] {
  const js: number[] = [];
  for (const p of partnersOf(s, label)) {
    const n = p.label === activePartner ? p.count - 1 : p.count;
    for (let k = 0; k < n; k++) js.push(p.jHz);
  }
  return js;
}

/** A spin's 1D multiplet in absolute frequency (Hz from the shift reference), intensity ∝ proton count. */
export function spinMultiplet(s: SpinSystem, label: string): { centreHz: number; lines: Line[] } {
  const spin = findSpin(s, label);
  const n = spinCount(spin);
  const lines = multipletLines(splittingsOf(s, label)).map((l) => ({ offsetHz: l.offsetHz, amplitude: l.amplitude * n }));
  return { centreHz: spin.ppm * s.observeMhz, lines };
}
