/**
 * The 1D side of the panel session with a fake webview and sidecar document and an in-process
 * analyser, on the simulated spectrum of fixture1D.ts (H-1 4.00 ppm, CH3 H-9 1.20 ppm, J = 7.0 Hz).
 */
import { describe, expect, it } from 'vitest';
import { analyseMultiplet, type MultipletAnalysis } from '../../src/core/report/multiplet';
import { addPick, applyEdits, formatSidecar, newSidecar, setCoupling } from '../../src/core/sidecar';
import { CancelledError } from '../../src/extension/fitClient';
import type { Analyser } from '../../src/extension/multipletSession';
import { PanelSession, type SessionPorts, type SidecarStore } from '../../src/extension/panelSession';
import { readSettings } from '../../src/extension/settings';
import { FLAG_NOTES } from '../../src/extension/multipletView';
import { parseToWebview, type MultipletView, type ToWebview } from '../../src/protocol';
import { J_HZ, multipletAt, testModel1D } from './fixture1D';
import { testModel } from './fixture';

const model = testModel1D();
const H1 = multipletAt(model, 4.0);
const H9 = multipletAt(model, 1.2);

function harness(initial: string | null = null, analyser?: Analyser, cosy: string | null = null) {
  const posted: ToWebview[] = [];
  const notes: string[] = [];
  const store: SidecarStore & { value: string | null; writes: number } = {
    fileName: '1h.jdx.couplet.yaml', value: initial, writes: 0,
    text: () => store.value,
    write: async (after: string) => ((store.value = after), store.writes++, true),
  };
  const s = model.spectrum;
  const counter = { runs: 0 };
  const inProcess: Analyser = {
    analyse: async (from, to, options) => {
      counter.runs++;
      if (s.dims !== 1) throw new Error('2D');
      return analyseMultiplet(s, from, to, options);
    },
    cancel: () => undefined,
  };
  const ports: SessionPorts = {
    post: (m) => void posted.push(m), settings: () => readSettings(() => undefined), knownLabels: async () => [],
    log: () => undefined, notify: (m) => void notes.push(m), inform: () => undefined,
    withProgress: (_t, work) => work(() => undefined, { cancelled: false, onCancel: () => undefined }),
    analyser: analyser ?? inProcess,
    folderSidecars: async () => (cosy === null ? [] : [{ fileName: 'cosy.jdx.couplet.yaml', text: cosy }]),
  };
  const session = new PanelSession(model, store, { measure: () => Promise.reject(new Error('1D')), cancel: () => undefined }, ports);
  return { session, posted, notes, store, counter };
}

async function analysed(h: ReturnType<typeof harness>, peakIndex: number, id = 1): Promise<MultipletView> {
  await h.session.receive({ type: 'analyse', id, peakIndex });
  const reply = h.posted.filter((m) => m.type === 'analysed' || m.type === 'error').at(-1);
  // What the webview receives passes its own validation.
  expect(parseToWebview(reply).ok).toBe(true);
  if (reply?.type !== 'analysed') throw new Error(`no analysis: ${JSON.stringify(reply)}`);
  return reply.analysis;
}

/** A sidecar with 1D picks on both multiplets, labelled; regions ±0.05 ppm when `regions`. */
function sidecarText(regions: boolean): string {
  let t = formatSidecar(newSidecar('1h.jdx', model.sha256));
  for (const [ppm, label] of [[4.0, 'H-1'], [1.2, 'H-9']] as const) {
    t = applyEdits(t, addPick(t, { f2Ppm: ppm, label: [label], kind: 'multiplet', ...(regions && { fromPpm: ppm + 0.05, toPpm: ppm - 0.05 }) }).edits);
  }
  return t;
}

/** The compound's DQF-COSY sidecar: one cross pick H-1/H-9 and its J. */
function cosyText(jHz: number): string {
  let t = formatSidecar(newSidecar('cosy.jdx', 'ab'.repeat(32)));
  const added = addPick(t, { f2Ppm: 4.0, f1Ppm: 1.2, label: ['H-1', 'H-9'], kind: 'cross' });
  t = applyEdits(t, added.edits);
  return applyEdits(t, setCoupling(t, { atoms: ['H-1', 'H-9'], jHz, jSdHz: 0.05, method: 'fit', dimension: 'F2', picks: [added.id], flags: [] }));
}

describe('1D multiplet analysis in the panel', () => {
  it('shows the selected multiplet: centre, q of J = 7.0 Hz (simulation input, ±0.05 Hz), no reference', async () => {
    const v = await analysed(harness(), H1);
    expect(v.centrePpm).toBeCloseTo(4.0, 3);
    expect(v.multiplicity).toBe('q');
    expect(v.couplings[0]?.jHz).toBeCloseTo(J_HZ, 1);
    expect(v.couplings[0]?.count).toBe(3);
    expect(v.protons).toBeNull();
    expect(v.reference).toMatch(/^no reference/);
    expect(v.regionSet).toBe(false);
    expect(v.pickId).toBeNull();
    // A q has four lines; the fitted curve covers the region's points.
    expect(v.linesPpm).toHaveLength(4);
    expect(v.fitted?.data.length).toBeGreaterThan(10);
  });

  it('counts protons against the reference pick: the CH3 holds 3 H when H-1 is the 1 H reference (intensity ∝ protons)', async () => {
    const h = harness(sidecarText(true));
    await analysed(h, H1);
    expect(await h.session.multiplet?.setReference(1)).toBe(true);
    expect(h.store.value).toContain('protons: 1');
    const ch3 = await analysed(h, H9, 2);
    expect(ch3.protons).toBeCloseTo(3, 1);
    expect(ch3.reference).toBe('reference p-4.0000 (H-1) = 1 H');
    expect(ch3.regionSet).toBe(true);
    const ref = await analysed(h, H1, 3);
    expect(ref.reference).toBe('this pick is the integral reference (1 H)');
    expect(ref.protons).toBeCloseTo(1, 6);
  });

  it('checks the 1D J against the COSY sidecar of the same folder, and flags a disagreement in plain words', async () => {
    const agrees = await analysed(harness(sidecarText(true), undefined, cosyText(7.02)), H1);
    expect(agrees.partners).toEqual(['H-9']);
    expect(agrees.cosy).toEqual([expect.objectContaining({ partner: 'H-9', cosyJHz: 7.02, agrees: true })]);
    expect(agrees.flags).not.toContain('cosy-disagrees');
    const differs = await analysed(harness(sidecarText(true), undefined, cosyText(9.0)), H1);
    expect(differs.cosy[0]?.agrees).toBe(false);
    expect(differs.flags).toContain('cosy-disagrees');
    expect(differs.notes).toContain(FLAG_NOTES['cosy-disagrees']);
  });

  it('answers a repeated request from its cache (a sidecar change that leaves the inputs alone costs nothing)', async () => {
    const h = harness();
    await analysed(h, H9, 1);
    await analysed(h, H9, 2);
    expect(h.counter.runs).toBe(1);
  });

  it('cancels a running analysis when another multiplet is selected; the stale request is answered as cancelled', async () => {
    const waiting: { resolve: (a: MultipletAnalysis) => void; reject: (e: Error) => void; from: number }[] = [];
    let cancels = 0;
    const analyser: Analyser = {
      analyse: (from) => new Promise((resolve, reject) => void waiting.push({ resolve, reject, from })),
      cancel: () => {
        cancels++;
        waiting.shift()?.reject(new CancelledError('cancelled'));
      },
    };
    const h = harness(null, analyser);
    const first = h.session.receive({ type: 'analyse', id: 1, peakIndex: H1 });
    await new Promise((r) => setTimeout(r, 0));
    const second = h.session.receive({ type: 'analyse', id: 2, peakIndex: H9 });
    await first;
    expect(cancels).toBe(1);
    expect(h.posted).toContainEqual({ type: 'error', inReplyTo: 1, message: 'analysis cancelled', cancelled: true });
    const s = model.spectrum;
    const w = waiting[0];
    if (s.dims !== 1 || !w) throw new Error('no second analysis');
    const m = model.multiplets[H9];
    w.resolve(analyseMultiplet(s, m?.fromPpm ?? 0, m?.toPpm ?? 0));
    await second;
    expect(h.posted.at(-1)).toMatchObject({ type: 'analysed', inReplyTo: 2 });
  });
});

describe('1D multiplet regions and the integral reference (sidecar edits)', () => {
  it('Shift+drag on a multiplet without a pick records a pick with the region (one write)', async () => {
    const h = harness();
    await h.session.receive({ type: 'setRegion', peakIndex: H9, fromPpm: 1.17, toPpm: 1.23 });
    expect(h.store.writes).toBe(1);
    expect(h.store.value).toContain('  - id: p-1.2000\n    f2_ppm: 1.2000\n    from_ppm: 1.2300\n    to_ppm: 1.1700\n    label: []\n    kind: multiplet\n');
    const v = await analysed(h, H9);
    expect([v.fromPpm, v.toPpm, v.regionSet, v.pickId]).toEqual([1.23, 1.17, true, 'p-1.2000']);
  });

  it('sets the region on the existing pick, and clears it again', async () => {
    const h = harness(sidecarText(false));
    await h.session.receive({ type: 'setRegion', peakIndex: H1, fromPpm: 3.96, toPpm: 4.04 });
    expect(h.store.value).toContain('from_ppm: 4.0400\n    to_ppm: 3.9600');
    expect(h.store.value?.match(/f2_ppm/g)).toHaveLength(2);
    expect(await h.session.multiplet?.setRegion(H1, null)).toBe(true);
    expect(h.store.value).toBe(sidecarText(false));
  });

  it('refuses a region away from every multiplet (the panel could never select such a pick), saying why, writing nothing', async () => {
    const h = harness(sidecarText(false));
    const before = h.store.value;
    await h.session.receive({ type: 'setRegion', peakIndex: null, fromPpm: 2.6, toPpm: 2.5 });
    expect(h.notes.at(-1)).toBe('no multiplet was picked between 2.600 and 2.500 ppm (nothing above the picking threshold there); a region is set on a picked multiplet');
    expect(h.store.value).toBe(before);
    expect(h.store.writes).toBe(0);
  });

  it('refuses a reference without a selected multiplet, or on a multiplet without a pick, saying why', async () => {
    const h = harness();
    expect(await h.session.multiplet?.setReference(3)).toBe(false);
    expect(h.notes.at(-1)).toBe('select a multiplet first (click it, or N / P)');
    await analysed(h, H9);
    expect(await h.session.multiplet?.setReference(3)).toBe(false);
    expect(h.notes.at(-1)).toMatch(/has no pick yet; pick it first \(A\)/);
    expect(h.store.writes).toBe(0);
  });

  it('moves the reference to another pick (one per sidecar) and clears it', async () => {
    const h = harness(sidecarText(false));
    await analysed(h, H1);
    await h.session.multiplet?.setReference(1);
    await analysed(h, H9, 2);
    await h.session.multiplet?.setReference(3);
    expect(h.store.value?.match(/protons:/g)).toHaveLength(1);
    expect(h.store.value).toContain('kind: multiplet\n    protons: 3');
    await h.session.multiplet?.setReference(null);
    expect(h.store.value).toBe(sidecarText(false));
  });

  it('answers analyse on a 2D spectrum with an error instead of leaving the request open', async () => {
    const posted: ToWebview[] = [];
    const s = new PanelSession(testModel(), { fileName: 'c', text: () => null, write: async () => true }, { measure: () => Promise.reject(new Error('x')), cancel: () => undefined }, {
      post: (m) => void posted.push(m), settings: () => readSettings(() => undefined), knownLabels: async () => [], log: () => undefined,
      notify: () => undefined, inform: () => undefined, withProgress: (_t, w) => w(() => undefined, { cancelled: false, onCancel: () => undefined }),
    });
    await s.receive({ type: 'analyse', id: 4, peakIndex: 0 });
    expect(posted.at(-1)).toMatchObject({ type: 'error', inReplyTo: 4 });
  });
});
