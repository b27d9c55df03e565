/**
 * The 1D multiplet analysis the panel shows, and what a Shift+drag along the trace means. Replies
 * come back out of order (a lineshape search takes up to seconds, a cached answer milliseconds):
 * only the reply to the latest request is shown. Pure (no DOM), tested in Node.
 */
import type { MultipletView, PeakView, SetRegionRequest } from '../src/protocol';
import { CancelledReply, type Rpc } from './rpc';

export class MultipletState {
  shown: MultipletView | null = null;
  private latest = 0;

  started(): number {
    return ++this.latest;
  }

  /** A reply; false (nothing changes) when a later request was made since. */
  analysed(token: number, v: MultipletView): boolean {
    if (token !== this.latest) return false;
    this.shown = v;
    return true;
  }

  /** A failed or cancelled reply: the last analysis no longer belongs to the selection. */
  failed(token: number): boolean {
    if (token !== this.latest) return false;
    this.shown = null;
    return true;
  }

  /** Sends `analyse` for a multiplet; `done` runs for the latest request only, with null on success or the reason it failed. */
  request(rpc: Rpc, peakIndex: number, done: (error: string | null) => void): void {
    const token = this.started();
    const req = rpc.requests.send(rpc.post, (id) => ({ type: 'analyse', id, peakIndex }));
    req.promise.then((m) => {
      if (m.type !== 'analysed') return void (this.failed(token) && done(`unexpected reply "${m.type}" to an analysis`));
      if (this.analysed(token, m.analysis)) done(null);
    }, (e: unknown) => {
      if (this.failed(token)) done(e instanceof CancelledReply ? 'Analysis cancelled.' : `Analysis failed: ${e instanceof Error ? e.message : String(e)}`);
    });
  }
}

const overlaps = (a0: number, a1: number, b0: number, b1: number): boolean =>
  Math.min(Math.max(a0, a1), Math.max(b0, b1)) >= Math.max(Math.min(a0, a1), Math.min(b0, b1));

/**
 * The region a Shift+drag sets, from its two ends in ppm: on the selected multiplet when the
 * region overlaps it, else on the multiplet whose centre lies in the region (the one nearest the
 * region's middle), else peakIndex null: no multiplet there (the host sets regions on picked
 * multiplets only, so nothing is sent; regionStatus says so).
 */
export function regionRequest(ppmA: number, ppmB: number, peaks: readonly PeakView[], selected: number | null): SetRegionRequest {
  const fromPpm = Math.max(ppmA, ppmB);
  const toPpm = Math.min(ppmA, ppmB);
  const sel = peaks.find((p) => p.index === selected);
  if (sel && overlaps(sel.extent.f2FromPpm, sel.extent.f2ToPpm, fromPpm, toPpm)) return { type: 'setRegion', peakIndex: sel.index, fromPpm, toPpm };
  const mid = (fromPpm + toPpm) / 2;
  const within = peaks.filter((p) => p.f2Ppm <= fromPpm && p.f2Ppm >= toPpm).sort((p, q) => Math.abs(p.f2Ppm - mid) - Math.abs(q.f2Ppm - mid));
  return { type: 'setRegion', peakIndex: within[0]?.index ?? null, fromPpm, toPpm };
}

/** The status line after a Shift+drag: what was asked, or why nothing was (no multiplet in the region). */
export function regionStatus(r: SetRegionRequest): string {
  const span = `${r.fromPpm.toFixed(4)}–${r.toPpm.toFixed(4)} ppm`;
  return r.peakIndex === null
    ? `No picked multiplet in ${span}: no region set (a region belongs to a multiplet the picking found; drag over its lines).`
    : `Region ${span} set (undo takes it back).`;
}

/** The analysis as text for the measurement area: numbers first, then a caution and the notes. */
export function multipletLines(v: MultipletView, jDecimals: number): string[] {
  const hz = (x: number): string => x.toFixed(jDecimals);
  const who = v.pickId === null ? 'no pick yet (A picks it)' : `${v.pickId}${v.label.length ? ` (${v.label.join(', ')})` : ''}`;
  const protons = v.protons === null ? 'no reference' : `${v.protons.toFixed(2)} H`;
  const lines = [
    `δ ${v.centrePpm.toFixed(4)} ppm   ${v.multiplicity}   ${who}`,
    `region ${v.fromPpm.toFixed(4)}–${v.toPpm.toFixed(4)} ppm (${v.regionSet ? 'set on the pick' : 'automatic; Shift+drag or Alt+R sets one'})`,
    `integral ${v.integral.toPrecision(4)}   protons: ${protons}   ${v.reference}`,
    // The automatic extent ends close to the outer lines and cuts their Lorentzian tails: counts come out low.
    ...(v.protons !== null && !v.regionSet ? ['Caution: automatic region; it cuts the line tails, so the proton count reads low. Set a region (Shift+drag, Alt+R) on this and the reference.'] : []),
    v.couplings.length > 0
      ? `J = ${v.couplings.map((c) => `${hz(c.jHz)} ± ${hz(c.sdHz)}${c.count > 1 ? ` (×${c.count})` : ''}`).join(', ')} Hz`
      : 'J: none reported',
  ];
  for (const c of v.cosy) {
    lines.push(`COSY ${c.partner}: ${hz(Math.abs(c.cosyJHz))} ± ${hz(c.cosySdHz)} Hz vs 1D ${hz(c.oneDJHz)} ± ${hz(c.oneDSdHz)} Hz: ${c.agrees ? 'agrees' : 'DISAGREES'}`);
  }
  if (v.cosy.length === 0) lines.push(v.partners.length > 0 ? `COSY: J to ${v.partners.join(', ')} recorded, but no 1D splitting to compare` : 'COSY: no recorded J for this atom (label the pick; measure the COSY)');
  if (v.flags.length > 0) lines.push(`flags: ${v.flags.join(', ')}`, 'Caution: do not report these splittings as J before checking (see the notes).');
  for (const n of v.notes) lines.push(`note: ${n}`);
  return lines;
}
