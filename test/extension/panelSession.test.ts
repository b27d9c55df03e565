/**
 * The host's message handling with a fake webview (records what is posted), a fake sidecar
 * document (holds text) and an in-process measurer, on the simulated spectrum of fixture.ts.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { measureCrossPeak } from '../../src/core/measure';
import { make1D } from '../../src/core/spectrum/spectrum';
import { makeAxis } from '../../src/core/spectrum/axis';
import { parseToWebview, type ToWebview } from '../../src/protocol';
import { CancelledError, FitFailedError } from '../../src/extension/fitClient';
import { PanelSession, type Measurer, type SessionPorts, type SidecarStore } from '../../src/extension/panelSession';
import { readSettings } from '../../src/extension/settings';
import { testModel } from './fixture';

interface Harness {
  session: PanelSession;
  posted: ToWebview[];
  logs: string[];
  notes: string[];
  infos: string[];
  store: SidecarStore & { value: string | null; writes: number };
  measured: number;
  /** Runs inside each measurement, before it returns (to act while a fit is in flight). */
  duringMeasure?: () => void;
}

function harness(initial: string | null = null, model = testModel(), overrides: Partial<SessionPorts> = {}): Harness {
  const h = { posted: [] as ToWebview[], logs: [] as string[], notes: [] as string[], infos: [] as string[], measured: 0 } as Harness;
  const store = {
    fileName: 'cosy.jdx.couplet.yaml', value: initial, writes: 0,
    text: () => store.value,
    write: async (after: string) => ((store.value = after), store.writes++, true),
  };
  h.store = store;
  const s2 = model.spectrum;
  const measurer: Measurer = {
    measure: async (peak, options) => {
      h.measured++;
      h.duringMeasure?.();
      if (s2.dims !== 2) throw new Error('1D');
      return measureCrossPeak(s2, peak, options);
    },
    cancel: () => undefined,
  };
  const ports: SessionPorts = {
    post: (m) => void h.posted.push(m),
    settings: () => readSettings(() => undefined),
    knownLabels: async () => ['H-1', 'H-2'],
    log: (m) => void h.logs.push(m),
    notify: (m) => void h.notes.push(m),
    inform: (m) => void h.infos.push(m),
    withProgress: (_title, work) => work(() => undefined, { cancelled: false, onCancel: () => undefined }),
    ...overrides,
  };
  h.session = new PanelSession(model, store, measurer, ports);
  return h;
}

const last = (h: Harness): ToWebview | undefined => h.posted[h.posted.length - 1];

describe('PanelSession', () => {
  let h: Harness;
  beforeEach(() => {
    h = harness();
  });

  it('answers the ready of a restored panel at once with the last label scan, refreshing it for the next time', async () => {
    const scans: ((labels: string[]) => void)[] = [];
    let calls = 0;
    const k = harness(null, testModel(), {
      knownLabels: () => (++calls === 1 ? Promise.resolve(['H-1']) : new Promise((resolve) => void scans.push(resolve))),
    });
    await k.session.receive({ type: 'ready' });
    await k.session.receive({ type: 'ready' }); // the scan started here has not answered
    const inits = k.posted.filter((m) => m.type === 'init');
    expect(inits.map((m) => m.type === 'init' && m.knownLabels)).toEqual([['H-1'], ['H-1']]);
    scans[0]?.(['H-1', 'H-9']);
    await Promise.resolve();
    await k.session.receive({ type: 'ready' });
    expect(k.posted.filter((m) => m.type === 'init').map((m) => m.type === 'init' && m.knownLabels).at(-1)).toEqual(['H-1', 'H-9']);
  }, 2000);

  it('calls afterInit once init is posted, so a reloaded webview gets the overlay back after its init', async () => {
    const order: string[] = [];
    const k = harness(null, testModel(), { afterInit: () => void order.push(`afterInit after ${k.posted.map((m) => m.type).join(',')}`) });
    await k.session.receive({ type: 'ready' });
    expect(order).toEqual(['afterInit after init']);
  });

  it('answers ready with init: spectrum axes, settings, peaks, sidecar and known labels', async () => {
    await h.session.receive({ type: 'ready' });
    const m = last(h);
    expect(m && parseToWebview(m).ok).toBe(true);
    if (m?.type !== 'init') throw new Error(`expected init, got ${m?.type}`);
    const s = testModel().spectrum;
    if (s.dims !== 2) throw new Error('fixture is 2D');
    expect(m.spectrum).toMatchObject({ fileName: 'cosy.jdx', dims: 2, f2: { points: s.f2.points, firstHz: s.f2.firstHz, observeMhz: 600 }, f1: { points: s.f1.points } });
    expect(m.spectrum.noise).toBe(testModel().noise);
    expect(m.spectrum.max).toBe(s.data.reduce((a, b) => Math.max(a, b), -Infinity));
    expect(m.peaks.map((p) => p.kind)).toEqual(['diagonal', 'cross', 'cross', 'diagonal']);
    expect(m.peaks[1]?.partner).toBe(2);
    expect(m.settings).toEqual(readSettings(() => undefined));
    expect(m.sidecar).toEqual({ picks: [], couplings: [], blocked: null });
    expect(m.knownLabels).toEqual(['H-1', 'H-2']);
  });

  it('still answers ready when the workspace label scan fails, logging why', async () => {
    const h2 = harness(null, testModel(), { knownLabels: () => Promise.reject(new Error('search is disabled')) });
    await h2.session.receive({ type: 'ready' });
    expect(last(h2)).toMatchObject({ type: 'init', knownLabels: [] });
    expect(h2.logs).toEqual(['could not collect atom labels from the workspace: search is disabled']);
  });

  it('answers a request whose handling failed unexpectedly, so the panel does not wait for ever (a stuck tile freezes the plot)', async () => {
    let first = true;
    const posted: ToWebview[] = [];
    const h2 = harness(null, testModel(), {
      post: (m) => {
        if (m.type === 'tile' && first) {
          first = false;
          throw new Error('clone failed');
        }
        posted.push(m);
      },
    });
    await h2.session.receive({ type: 'requestTile', id: 5, region: { row0: 0, row1: 7, col0: 0, col1: 7 }, maxRows: 8, maxCols: 8 });
    expect(posted).toEqual([{ type: 'error', inReplyTo: 5, message: 'Couplet could not handle "requestTile": clone failed' }]);
  });

  it('turns an unexpected failure into an error message instead of silence', async () => {
    const h2 = harness(null, testModel(), { settings: () => { throw new Error('boom'); } });
    await h2.session.receive({ type: 'ready' });
    expect(last(h2)).toEqual({ type: 'error', message: 'Couplet could not handle "ready": boom' });
    expect(h2.logs[0]).toMatch(/^cosy\.jdx: handling "ready" failed: Error: boom/);
  });

  it('ignores and logs a message that fails validation; a request with an id gets an error reply, so the panel does not wait forever', async () => {
    await h.session.receive({ type: 'measure', id: 1, peakIndex: -1, method: 'fit', dimension: 'F2' });
    await h.session.receive({ type: 'eraseAll' });
    await h.session.receive('ready');
    await h.session.receive({ type: 'requestTile', id: 2.5 });
    expect(h.posted).toEqual([{ type: 'error', inReplyTo: 1, message: 'Couplet did not understand the request: message "measure": field "peakIndex" is missing or invalid' }]);
    expect(h.logs).toEqual([
      'ignored a message from the cosy.jdx panel: message "measure": field "peakIndex" is missing or invalid',
      'ignored a message from the cosy.jdx panel: unknown message type "eraseAll"',
      'ignored a message from the cosy.jdx panel: message is not an object with a string "type"',
      'ignored a message from the cosy.jdx panel: message "requestTile": field "id" is missing or invalid',
    ]);
  });

  it('answers requestTile with a Float32Array no larger than asked, and an error outside the grid', async () => {
    await h.session.receive({ type: 'requestTile', id: 7, region: { row0: 0, row1: 127, col0: 0, col1: 1023 }, maxRows: 64, maxCols: 300 });
    const t = last(h);
    if (t?.type !== 'tile') throw new Error(`expected tile, got ${t?.type}`);
    expect(t.inReplyTo).toBe(7);
    expect(t.data).toBeInstanceOf(Float32Array);
    expect(t.rows).toBeLessThanOrEqual(64);
    expect(t.cols).toBeLessThanOrEqual(300);
    expect(t.data.length).toBe(t.rows * t.cols);
    await h.session.receive({ type: 'requestTile', id: 8, region: { row0: 0, row1: 128, col0: 0, col1: 10 }, maxRows: 4, maxCols: 4 });
    expect(last(h)).toEqual({ type: 'error', inReplyTo: 8, message: 'tile rows 0..128, cols 0..10 are outside the 128 x 1024 grid of cosy.jdx' });
  });

  it('answers measure with the measurement (J near the simulated 7.5 Hz) and typed-array traces', async () => {
    await h.session.receive({ type: 'measure', id: 3, peakIndex: 1, method: 'fit', dimension: 'F2' });
    const m = last(h);
    if (m?.type !== 'measured') throw new Error(`expected measured, got ${m?.type}: ${JSON.stringify(m)}`);
    expect(m.inReplyTo).toBe(3);
    // fixture.ts simulates J = 7.5 Hz at SNR 300; the fit's own sigma is a few 0.01 Hz.
    expect(Math.abs(m.measurement.jHz - 7.5)).toBeLessThan(0.3);
    expect(m.measurement.traces[0]?.data).toBeInstanceOf(Float32Array);
    expect(parseToWebview(m).ok).toBe(true);
  });

  it('refuses to measure a diagonal peak, saying why', async () => {
    await h.session.receive({ type: 'measure', id: 4, peakIndex: 0, method: 'fit', dimension: 'F2' });
    expect(last(h)).toMatchObject({ type: 'error', inReplyTo: 4, message: expect.stringMatching(/^peak 0 at F2 4\.\d{4} \/ F1 4\.\d{4} ppm is a diagonal peak/) });
  });

  it('accept after measure writes the pick and the coupling with the shown values, measuring once', async () => {
    await h.session.receive({ type: 'measure', id: 5, peakIndex: 1, method: 'fit', dimension: 'F2' });
    const shown = last(h);
    if (shown?.type !== 'measured') throw new Error('expected measured');
    await h.session.receive({ type: 'accept', peakIndex: 1, method: 'fit', dimension: 'F2', labels: ['H-1', 'H-2'] });
    expect(h.measured).toBe(1);
    expect(h.store.writes).toBe(1);
    const text = h.store.value ?? '';
    const p = testModel().crossPeaks[1];
    expect(text).toContain(`    f2_ppm: ${p?.f2Ppm.toFixed(4)}\n    f1_ppm: ${p?.f1Ppm.toFixed(4)}\n    label: [H-1, H-2]\n    kind: cross\n`);
    expect(text).toContain(`  - atoms: [H-1, H-2]\n    j_hz: ${shown.measurement.jHz.toFixed(2)}\n    j_sd_hz: ${shown.measurement.jSdHz.toFixed(2)}\n    method: fit\n    dimension: F2\n`);
  });

  it('posts the new sidecar view when the document changes (edit, undo or checkout)', async () => {
    await h.session.receive({ type: 'accept', peakIndex: 1, method: 'fit', dimension: 'F2', labels: ['H-1', 'H-2'] });
    h.session.sidecarChanged();
    const m = last(h);
    if (m?.type !== 'sidecar') throw new Error('expected sidecar');
    expect(m.sidecar.picks.map((p) => p.label)).toEqual([['H-1', 'H-2']]);
    expect(m.sidecar.couplings).toHaveLength(1);
    h.store.value = null;
    h.session.sidecarChanged();
    expect(last(h)).toEqual({ type: 'sidecar', sidecar: { picks: [], couplings: [], blocked: null } });
  });

  it('does not write a sidecar whose data hash does not match the spectrum, and says where', async () => {
    const other = `schema: couplet-sidecar/1\ndata:\n  file: cosy.jdx\n  sha256: ${'f0'.repeat(32)}\n\npicks: []\n\ncouplings: []\n`;
    h = harness(other);
    await h.session.receive({ type: 'accept', peakIndex: 1, method: 'fit', dimension: 'F2', labels: ['H-1', 'H-2'] });
    expect(h.store.value).toBe(other);
    expect(h.store.writes).toBe(0);
    expect(h.notes).toHaveLength(1);
    expect(h.notes[0]).toMatch(/^cosy\.jdx\.couplet\.yaml:4: data\.sha256: cosy\.jdx has changed since these picks were made .*Couplet will not write it until then\.$/);
    expect(last(h)).toEqual({ type: 'error', message: h.notes[0] });
  });

  it('labels and removes picks through the sidecar', async () => {
    await h.session.receive({ type: 'accept', peakIndex: 2, method: 'fit', dimension: 'F2', labels: [] });
    const id = h.session.state().view.picks[0]?.id ?? '';
    expect(h.session.state().view.couplings).toEqual([]);
    await h.session.receive({ type: 'label', pickId: id, labels: ['H-2', 'H-1'] });
    // The measurement accepted before the labels becomes the coupling now.
    expect(h.session.state().view.couplings.map((c) => c.atoms)).toEqual([['H-1', 'H-2']]);
    await h.session.receive({ type: 'removePick', pickId: id });
    expect(h.session.state().view.picks).toEqual([]);
    expect(h.store.writes).toBe(3);
  });

  it('measures all cross peaks with progress, skipping the diagonal', async () => {
    const r = await h.session.measureAll('naive');
    expect(r).toEqual({ measured: 2, failed: [], cancelled: false });
    expect(h.posted.filter((m) => m.type === 'progress').map((m) => m.type === 'progress' && m.done)).toEqual([0, 1, 2]);
    expect(h.logs).toHaveLength(2);
    expect(h.logs[0]).toMatch(/^cosy\.jdx peak 1 \(F2 4\.\d{4} \/ F1 3\.\d{4} ppm\): J = \d+\.\d\d ± \d+\.\d\d Hz, naive F2/);
    expect(h.infos).toEqual(['cosy.jdx: 2 of 2 cross peaks measured; values in the Couplet output, ready to accept.']);
  });

  it('stops measuring all when cancelled, reporting what was done', async () => {
    let cancel: (() => void) | undefined;
    const token = { cancelled: false, onCancel: (f: () => void) => void (cancel = f) };
    // Cancel as soon as the first progress report arrives (the user pressing the cancel button).
    const h2 = harness(null, testModel(), {
      withProgress: (_t, work) => work(() => {
        token.cancelled = true;
        cancel?.();
      }, token),
    });
    const r = await h2.session.measureAll('naive');
    expect(r.cancelled).toBe(true);
    expect(r.measured).toBeLessThan(2);
  });
});

describe('PanelSession: cancel and close', () => {
  it('stops measuring all when the panel sends cancel (Esc), also when it arrives between two fits', async () => {
    const h = harness();
    // The in-process measurer cannot be interrupted: cancel lands while fit 1 runs and must stop fit 2.
    h.duringMeasure = () => void h.session.receive({ type: 'cancel' });
    const r = await h.session.measureAll('naive');
    expect(r).toEqual({ measured: 1, failed: [], cancelled: true });
    expect(h.measured).toBe(1);
  });

  it('posts nothing once the panel is closed, ignores its late messages, and ends a running batch', async () => {
    const h = harness();
    h.duringMeasure = () => h.session.dispose();
    const r = await h.session.measureAll('naive');
    expect(r.cancelled).toBe(true);
    expect(h.measured).toBe(1);
    const before = h.posted.length;
    await h.session.receive({ type: 'ready' });
    await h.session.receive({ type: 'measure', id: 7, peakIndex: 1, method: 'naive', dimension: 'F2' });
    h.session.sidecarChanged();
    expect(h.posted.length).toBe(before);
    expect(h.measured).toBe(1);
  });

  it('still measures all after an earlier cancel (a cancel ends only the batch it met)', async () => {
    const h = harness();
    await h.session.receive({ type: 'cancel' });
    expect(await h.session.measureAll('naive')).toEqual({ measured: 2, failed: [], cancelled: false });
  });
});

describe('PanelSession on a 1D spectrum', () => {
  // Two Lorentzian lines 7 Hz apart at 3.00 ppm (600 MHz) on a flat baseline: one multiplet.
  const axis = makeAxis(2048, 2000, 1600, 600);
  const data = Float64Array.from({ length: 2048 }, (_, i) => {
    const hz = 2000 - (i * 400) / 2047;
    return [1803.5, 1796.5].reduce((s, c) => s + 100 / (1 + ((2 * (hz - c)) / 1.2) ** 2), 0) + 0.01 * Math.sin(i * 12.9898);
  });
  const spectrum = make1D('doublet', data, axis);
  const model = { fileName: '1h.jdx', sha256: 'cd'.repeat(32), spectrum, noise: 0.01, crossPeaks: [], multiplets: [{ ppm: 3, hz: 1800, fromPpm: 3.01, toPpm: 2.99, point0: 0, point1: 1, height: 100, lines: [] }] };

  it('records a multiplet pick without a coupling, and refuses to measure it with a reason', async () => {
    const h = harness(null, model);
    await h.session.receive({ type: 'measure', id: 1, peakIndex: 0, method: 'fit', dimension: 'F2' });
    expect(last(h)).toMatchObject({ type: 'error', inReplyTo: 1, message: expect.stringContaining('1h.jdx is a 1D spectrum') });
    await h.session.receive({ type: 'accept', peakIndex: 0, method: 'fit', dimension: 'F2', labels: ['H-3'] });
    expect(h.store.value).toContain('  - id: p-3.0000\n    f2_ppm: 3.0000\n    label: H-3\n    kind: multiplet\n');
    expect(h.store.value).toContain('couplings: []\n');
  });
});

describe('PanelSession.recordDataHash', () => {
  const stale = (sha: string, extra = ''): string => `schema: couplet-sidecar/1\ndata:\n  file: cosy.jdx\n  sha256: ${sha}\n\npicks: []\n\ncouplings: []\n${extra}`;

  it('writes the spectrum hash over a mismatching one, changing only that line', async () => {
    const h = harness(stale('f0'.repeat(32)));
    expect(await h.session.recordDataHash()).toBe(true);
    expect(h.store.value).toBe(stale(testModel().sha256));
    expect(h.session.state().view.blocked).toBeNull();
  });

  it('refuses when the sidecar has another error too (here a syntax error), naming it', async () => {
    const h = harness(stale('f0'.repeat(32), 'note: [unclosed\n'));
    expect(await h.session.recordDataHash()).toBe(false);
    expect(h.notes[0]).toMatch(/^cosy\.jdx\.couplet\.yaml:\d+: .* — fix this first$/);
    expect(h.store.writes).toBe(0);
  });

  it('refuses when there is nothing to record', async () => {
    const h = harness(stale(testModel().sha256));
    expect(await h.session.recordDataHash()).toBe(false);
    expect(h.notes).toEqual(['cosy.jdx.couplet.yaml already matches cosy.jdx; nothing to record']);
  });
});

describe('PanelSession when a measurement fails', () => {
  function failing(error: Error): Harness {
    const h = harness();
    const measurer: Measurer = { measure: async () => Promise.reject(error), cancel: () => undefined };
    const ports: SessionPorts = {
      post: (m) => void h.posted.push(m), settings: () => readSettings(() => undefined), knownLabels: async () => [],
      log: (m) => void h.logs.push(m), notify: (m) => void h.notes.push(m), inform: (m) => void h.infos.push(m),
      withProgress: (_t, work) => work(() => undefined, { cancelled: false, onCancel: () => undefined }),
    };
    h.session = new PanelSession(testModel(), h.store, measurer, ports);
    return h;
  }

  it('still records the pick with its labels (no coupling) and says why there is no J', async () => {
    const h = failing(new FitFailedError('window in F2 at 4.0000 ppm has fewer than 6 points'));
    await h.session.receive({ type: 'accept', peakIndex: 1, method: 'fit', dimension: 'F2', labels: ['H-1', 'H-2'] });
    const view = h.session.state().view;
    expect(view.picks.map((p) => p.label)).toEqual([['H-1', 'H-2']]);
    expect(view.couplings).toEqual([]);
    expect(h.infos).toEqual([`${view.picks[0]?.id} recorded without J (labels only): the measurement failed: window in F2 at 4.0000 ppm has fewer than 6 points`]);
    expect(h.notes).toEqual([]);
  });

  it('marks the reply to a cancelled measure as cancelled (the panel must not offer a bare pick for it)', async () => {
    const h = failing(new CancelledError('measurement cancelled'));
    await h.session.receive({ type: 'measure', id: 9, peakIndex: 1, method: 'fit', dimension: 'F2' });
    expect(last(h)).toEqual({ type: 'error', inReplyTo: 9, message: 'measurement cancelled', cancelled: true });
    const m = last(h);
    expect(m && parseToWebview(m).ok).toBe(true);
  });

  it('records nothing when the user cancelled the measurement', async () => {
    const h = failing(new CancelledError('cancelled'));
    await h.session.receive({ type: 'accept', peakIndex: 1, method: 'fit', dimension: 'F2', labels: ['H-1', 'H-2'] });
    expect(h.store.value).toBeNull();
    expect(h.notes).toEqual(['not accepted: cancelled']);
  });
});

describe('PanelSession.settingsChanged', () => {
  it('posts the current settings to the open panel as a valid settings message', () => {
    let levels = 10;
    const h = harness(null, testModel(), { settings: () => readSettings((k) => (k === 'couplet.contours.levels' ? levels : undefined)) });
    levels = 25; // the user edits couplet.contours.levels while the panel is open
    h.session.settingsChanged();
    const m = last(h);
    expect(m && parseToWebview(m).ok).toBe(true);
    expect(m).toEqual({ type: 'settings', settings: { ...readSettings(() => undefined), contours: { ...readSettings(() => undefined).contours, levels: 25 } } });
  });
});

describe('PanelSession.removePick', () => {
  it('removes the coupling measured at the pick with it, in one write, and tells the user', async () => {
    const h = harness();
    await h.session.receive({ type: 'accept', peakIndex: 1, method: 'naive', dimension: 'F2', labels: ['H-1', 'H-2'] });
    const id = h.session.state().view.picks[0]?.id ?? '';
    expect(h.session.state().view.couplings).toHaveLength(1);
    await h.session.receive({ type: 'removePick', pickId: id });
    expect(h.session.state().view).toEqual({ picks: [], couplings: [], blocked: null });
    expect(h.store.writes).toBe(2); // one for accept, one for the removal of pick and coupling together
    expect(h.infos[0]).toMatch(new RegExp(`^removed ${id} and the coupling measured at it: H-1–H-2 \\(naive F2, J = \\d+\\.\\d\\d Hz\\) \\(undo brings them back\\)$`));
  });
});
