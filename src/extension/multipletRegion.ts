/**
 * 1D multiplet regions and the integral reference, host side and pure: reading what the chemist
 * types ("3.86 3.78", "3.86-3.78", "3"), finding the pick that belongs to an automatic multiplet,
 * and the sidecar text changes (built from the core's edits, so each is canonical and one undo step).
 */
import type { Multiplet1D } from '../core/peaks';
import { applyEdits, parseSidecar, setIntegralReference, setPickRegion, type Pick } from '../core/sidecar';
import { acceptText } from './sidecarActions';

export interface Region {
  readonly fromPpm: number;
  readonly toPpm: number;
}

const NUM = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)`;
/** Two shifts separated by white space (either may be negative), ... */
const SPACED = new RegExp(String.raw`^\s*(${NUM})\s+(${NUM})\s*(?:ppm)?\s*$`, 'i');
/** ... or by a dash, "..", or "to" ("3.86-3.78", "3.86 – 3.78"). */
const DASHED = new RegExp(String.raw`^\s*(${NUM})\s*(?:-|–|—|\.\.|to)\s*(${NUM})\s*(?:ppm)?\s*$`, 'i');

/**
 * Reads a region typed in the input box; returns it (high, low) or the message to show. `limits`
 * is the spectrum's ppm range (either order).
 */
export function parseRegionInput(text: string, limits: readonly [number, number]): Region | string {
  const m = SPACED.exec(text) ?? DASHED.exec(text);
  if (!m) return 'Type two shifts in ppm, e.g. "3.86 3.78" or "3.86-3.78".';
  const a = Number(m[1]);
  const b = Number(m[2]);
  if (!Number.isFinite(a) || !Number.isFinite(b)) return 'Both shifts must be numbers.';
  if (a === b) return `The two shifts are equal (${a} ppm); a region needs two different shifts.`;
  const lo = Math.min(...limits);
  const hi = Math.max(...limits);
  const outside = [a, b].find((v) => v < lo || v > hi);
  if (outside !== undefined) return `${outside} ppm is outside the spectrum (${hi.toFixed(2)} to ${lo.toFixed(2)} ppm).`;
  return { fromPpm: Math.max(a, b), toPpm: Math.min(a, b) };
}

/** Reads the proton count of the integral reference: a whole number from 1 to 99. */
export function parseProtonsInput(text: string): number | string {
  const t = text.trim();
  if (!/^\d+$/.test(t)) return 'Type a whole number of protons, e.g. 3 for a CH3.';
  const n = Number(t);
  return n >= 1 && n <= 99 ? n : `A reference holds 1 to 99 protons, not ${n}.`;
}

const inside = (ppm: number, a: number, b: number): boolean => ppm <= Math.max(a, b) && ppm >= Math.min(a, b);

/**
 * The pick of an automatic multiplet: a 1D pick lying inside the multiplet's extent, or whose own
 * region holds the multiplet's centre; the nearest to the centre when several do.
 */
export function pickOfMultiplet(picks: readonly Pick[], m: Multiplet1D): Pick | undefined {
  const near = picks.filter((p) => p.f1Ppm === undefined && (p.kind === undefined || p.kind === 'multiplet')
    && (inside(p.f2Ppm, m.fromPpm, m.toPpm) || (p.fromPpm !== undefined && p.toPpm !== undefined && inside(m.ppm, p.fromPpm, p.toPpm))));
  return near.sort((a, b) => Math.abs(a.f2Ppm - m.ppm) - Math.abs(b.f2Ppm - m.ppm))[0];
}

/** The picks of a sidecar text ([] without a readable one). */
export function picksOf(text: string | null, fileName: string): Pick[] {
  return text === null ? [] : parseSidecar(text, fileName).sidecar?.picks ?? [];
}

export interface RegionTarget {
  /** The pick to change; absent to make a new multiplet pick at `f2Ppm`. */
  readonly pickId?: string;
  readonly f2Ppm: number;
  readonly dataFileName: string;
  readonly sha256: string;
}

/**
 * Sets (or with null clears) the region of the target's pick; without a pick, records a new
 * multiplet pick there first (creating the sidecar when there is none). Throws with the reason.
 */
export function regionText(text: string | null, sidecarName: string, t: RegionTarget, region: Region | null): { text: string; pickId: string } {
  let pickId = t.pickId;
  let after = text;
  if (pickId === undefined) {
    if (region === null) throw new Error('the selected multiplet has no pick, so it has no region to clear');
    const r = acceptText(text, sidecarName, { dataFileName: t.dataFileName, sha256: t.sha256, f2Ppm: t.f2Ppm, kind: 'multiplet', labels: [] });
    pickId = r.pickId;
    after = r.text;
  }
  if (after === null) throw new Error(`${sidecarName} does not exist yet`);
  return { text: applyEdits(after, setPickRegion(after, pickId, region, sidecarName)), pickId };
}

/** Makes the pick the integral reference with `protons` protons (clearing any other), or clears it with null. */
export function referenceText(text: string | null, sidecarName: string, pickId: string, protons: number | null): string {
  if (text === null) throw new Error(`${sidecarName} does not exist yet; pick the multiplet first (A)`);
  return applyEdits(text, setIntegralReference(text, pickId, protons, sidecarName));
}
