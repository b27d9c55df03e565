import type { DimensionProcessing, WindowFunction } from '../spectrum/processing';
import { JcampError } from './errors';

/**
 * Our private label for known processing, one per dimension (the `$` prefix marks a private label
 * in JCAMP-DX; other readers ignore it):
 *
 *   ##$COUPLET PROCESSING F2= acquired=1024 sw_hz=6000 carrier_hz=2500 size=2048 window=sine:2:90
 *
 * Keys (all required, any order, separated by blanks):
 *   acquired    complex points acquired before zero-filling (integer >= 1)
 *   sw_hz       spectral width, Hz (> 0)
 *   carrier_hz  frequency of the spectrum centre relative to the shift reference, Hz
 *   size        points after zero-filling (integer >= acquired)
 *   window      none | exponential:<lb Hz> | sine:<power 1|2>:<shift deg>
 * Numbers are written in the shortest form that reads back to the same double, so they round-trip.
 * 1D files use `##$COUPLET PROCESSING=`, 2D files `... F1=` and `... F2=`.
 */
export const PROCESSING_LABEL = '$COUPLETPROCESSING';
export const PROCESSING_RAW_LABEL = '$COUPLET PROCESSING';

export function formatProcessing(p: DimensionProcessing): string {
  return `acquired=${p.acquiredPoints} sw_hz=${p.spectralWidthHz} carrier_hz=${p.carrierHz} size=${p.size} window=${formatWindow(p.window)}`;
}

function formatWindow(w: WindowFunction): string {
  switch (w.kind) {
    case 'none':
      return 'none';
    case 'exponential':
      return `exponential:${w.lbHz}`;
    case 'sine':
      return `sine:${w.power}:${w.shiftDeg}`;
  }
}

const KEYS = ['acquired', 'sw_hz', 'carrier_hz', 'size', 'window'] as const;

/** Parse the value of a processing label; any unknown, missing or malformed key is an error. */
export function parseProcessing(value: string, file: string, line: number, field: string): DimensionProcessing {
  const bad = (msg: string): never => {
    throw new JcampError(file, line, msg, field);
  };
  const fields = new Map<string, string>();
  for (const part of value.split(/\s+/).filter((s) => s !== '')) {
    const eq = part.indexOf('=');
    const key = eq < 0 ? part : part.slice(0, eq);
    if (eq < 0 || !(KEYS as readonly string[]).includes(key)) bad(`unknown item "${part}" (expected ${KEYS.join(', ')})`);
    if (fields.has(key)) bad(`"${key}" given twice`);
    fields.set(key, part.slice(eq + 1));
  }
  const num = (key: string): number => {
    const t = fields.get(key);
    if (t === undefined) return bad(`missing "${key}="`);
    const v = t === '' ? Number.NaN : Number(t);
    return Number.isFinite(v) ? v : bad(`"${key}=${t}" is not a number`);
  };
  const acquiredPoints = num('acquired');
  const spectralWidthHz = num('sw_hz');
  const carrierHz = num('carrier_hz');
  const size = num('size');
  if (!Number.isInteger(acquiredPoints) || acquiredPoints < 1) bad(`acquired=${acquiredPoints} must be a positive integer`);
  if (!Number.isInteger(size) || size < acquiredPoints) bad(`size=${size} must be an integer >= acquired (${acquiredPoints})`);
  if (!(spectralWidthHz > 0)) bad(`sw_hz=${spectralWidthHz} must be positive`);
  const window = parseWindow(fields.get('window') ?? bad('missing "window="'), bad);
  return { acquiredPoints, spectralWidthHz, carrierHz, window, size };
}

function parseWindow(text: string, bad: (msg: string) => never): WindowFunction {
  const [kind, ...args] = text.split(':');
  const nums = args.map((a) => (a === '' ? Number.NaN : Number(a)));
  if (nums.some((v) => !Number.isFinite(v))) bad(`window "${text}" has a non-numeric parameter`);
  if (kind === 'none' && nums.length === 0) return { kind: 'none' };
  if (kind === 'exponential' && nums.length === 1) return { kind: 'exponential', lbHz: nums[0] ?? 0 };
  if (kind === 'sine' && nums.length === 2 && (nums[0] === 1 || nums[0] === 2)) {
    return { kind: 'sine', power: nums[0], shiftDeg: nums[1] ?? 0 };
  }
  return bad(`window "${text}" is not none, exponential:<lb Hz> or sine:<1|2>:<shift deg>`);
}
