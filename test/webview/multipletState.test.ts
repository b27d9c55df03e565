/** The 1D multiplet in the panel, without a browser: which region a Shift+drag sets, stale replies, the text shown. */
import { describe, expect, it } from 'vitest';
import type { MultipletView, PeakView } from '../../src/protocol';
import type { FromWebview } from '../../src/protocol';
import { MultipletState, multipletLines, regionRequest, regionStatus } from '../../webview/multipletState';
import { Requests, type Rpc } from '../../webview/rpc';

const peak = (index: number, f2Ppm: number, half = 0.02): PeakView =>
  ({ index, kind: 'multiplet', f2Ppm, extent: { f2FromPpm: f2Ppm + half, f2ToPpm: f2Ppm - half }, partner: null });
const peaks = [peak(0, 3.82), peak(1, 3.62), peak(2, 1.17, 0.006)];

describe('regionRequest (Shift+drag along the 1D trace)', () => {
  it('sets the region of the selected multiplet when the drag overlaps it, ends in either order', () => {
    expect(regionRequest(3.78, 3.86, peaks, 0)).toEqual({ type: 'setRegion', peakIndex: 0, fromPpm: 3.86, toPpm: 3.78 });
    // Overlapping only its edge still means the selected one.
    expect(regionRequest(3.835, 3.9, peaks, 0).peakIndex).toBe(0);
  });

  it('otherwise takes the multiplet whose centre is inside, the one nearest the middle', () => {
    expect(regionRequest(3.6, 3.64, peaks, 0)).toEqual({ type: 'setRegion', peakIndex: 1, fromPpm: 3.64, toPpm: 3.6 });
    expect(regionRequest(3.9, 3.5, peaks, null).peakIndex).toBe(1); // middle 3.70: 3.62 is nearer than 3.82
  });

  it('names no multiplet (peakIndex null) where none is, and the status says no region was set (the host refuses one there)', () => {
    const r = regionRequest(2.6, 2.5, peaks, 2);
    expect(r).toEqual({ type: 'setRegion', peakIndex: null, fromPpm: 2.6, toPpm: 2.5 });
    expect(regionStatus(r)).toBe('No picked multiplet in 2.6000–2.5000 ppm: no region set (a region belongs to a multiplet the picking found; drag over its lines).');
    expect(regionStatus(regionRequest(3.78, 3.86, peaks, 0))).toBe('Region 3.8600–3.7800 ppm set (undo takes it back).');
  });
});

const view: MultipletView = {
  peakIndex: 0, pickId: 'p-3.8200', label: ['H-4'], centrePpm: 3.82, fromPpm: 3.848, toPpm: 3.793, regionSet: false,
  integral: 1388.2, protons: null, reference: 'no reference (set one with Couplet: Set Integral Reference…)', multiplicity: 'tt',
  couplings: [{ jHz: 11.17, sdHz: 0.021, count: 2 }, { jHz: 4.53, sdHz: 0.02, count: 2 }], flags: [], notes: [], cosy: [], partners: [],
  linesPpm: [], fitted: null,
};

describe('multipletLines', () => {
  it('gives centre, multiplicity, region and its origin, integral without a reference, and J ± sd with the partner count', () => {
    const l = multipletLines(view, 2);
    expect(l[0]).toBe('δ 3.8200 ppm   tt   p-3.8200 (H-4)');
    expect(l[1]).toBe('region 3.8480–3.7930 ppm (automatic; Shift+drag or Alt+R sets one)');
    expect(l[2]).toMatch(/^integral 1388 {3}protons: no reference {3}no reference/);
    expect(l[3]).toBe('J = 11.17 ± 0.02 (×2), 4.53 ± 0.02 (×2) Hz');
    expect(l.some((x) => x.startsWith('Caution'))).toBe(false);
  });

  it('cautions when flagged, when a count rests on automatic regions, and says when the COSY disagrees', () => {
    const l = multipletLines({
      ...view, protons: 0.87, flags: ['cosy-disagrees'], notes: ['COSY disagrees: …'],
      cosy: [{ partner: 'H-3b', cosyJHz: -6.0, cosySdHz: 0.05, oneDJHz: 4.53, oneDSdHz: 0.02, agrees: false }], partners: ['H-3b'],
    }, 1);
    expect(l).toContain('COSY H-3b: 6.0 ± 0.1 Hz vs 1D 4.5 ± 0.0 Hz: DISAGREES');
    expect(l).toContain('flags: cosy-disagrees');
    expect(l.filter((x) => x.startsWith('Caution'))).toHaveLength(2);
    expect(l.at(-1)).toBe('note: COSY disagrees: …');
  });

  it('says when no J is reported and when the pick has no label to look partners up by', () => {
    const l = multipletLines({ ...view, pickId: null, label: [], couplings: [], multiplicity: 'm' }, 2);
    expect(l[0]).toBe('δ 3.8200 ppm   m   no pick yet (A picks it)');
    expect(l).toContain('J: none reported');
    expect(l).toContain('COSY: no recorded J for this atom (label the pick; measure the COSY)');
  });
});

describe('MultipletState', () => {
  it('shows only the reply to the latest request (a slow fit of the first multiplet arrives after the second)', () => {
    const s = new MultipletState();
    const first = s.started();
    const second = s.started();
    expect(s.analysed(second, { ...view, peakIndex: 1 })).toBe(true);
    expect(s.analysed(first, view)).toBe(false);
    expect(s.shown?.peakIndex).toBe(1);
    expect(s.failed(first)).toBe(false);
    const third = s.started();
    expect(s.failed(third)).toBe(true);
    expect(s.shown).toBeNull();
  });
});

describe('MultipletState.request', () => {
  it('asks the host with the multiplet index and reports only the latest reply; a cancelled one says so', async () => {
    const sent: FromWebview[] = [];
    const rpc: Rpc = { post: (m) => void sent.push(m), requests: new Requests() };
    const s = new MultipletState();
    const done: (string | null)[] = [];
    s.request(rpc, 0, (e) => void done.push(e));
    s.request(rpc, 1, (e) => void done.push(e));
    expect(sent).toEqual([{ type: 'analyse', id: 1, peakIndex: 0 }, { type: 'analyse', id: 2, peakIndex: 1 }]);
    rpc.requests.resolve(2, { type: 'analysed', inReplyTo: 2, analysis: { ...view, peakIndex: 1 } });
    rpc.requests.reject(1, 'analysis cancelled', true);
    await new Promise((r) => setTimeout(r, 0));
    expect(done).toEqual([null]);
    expect(s.shown?.peakIndex).toBe(1);
    s.request(rpc, 2, (e) => void done.push(e));
    rpc.requests.reject(3, 'analysis cancelled', true);
    await new Promise((r) => setTimeout(r, 0));
    expect(done).toEqual([null, 'Analysis cancelled.']);
    expect(s.shown).toBeNull();
  });
});
