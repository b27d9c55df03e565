/** Validation of messages crossing the host/webview boundary (src/protocol.ts). */
import { describe, expect, it } from 'vitest';
import { readSettings } from '../../src/extension/settings';
import { parseFromWebview, parseToWebview, type FromWebview } from '../../src/protocol';

const region = { row0: 0, row1: 9, col0: 2, col1: 5 };
const valid: FromWebview[] = [
  { type: 'ready' },
  { type: 'requestTile', id: 0, region, maxRows: 1, maxCols: 800 },
  { type: 'measure', id: 3, peakIndex: 0, method: 'naive', dimension: 'F1' },
  { type: 'accept', peakIndex: 2, method: 'fit', dimension: 'F2', labels: [] },
  { type: 'label', pickId: 'p-4.2000-3.8500', labels: ['H-1', 'H-2'] },
  { type: 'removePick', pickId: 'p-1' },
  { type: 'measureAll', method: 'fit' },
  { type: 'analyse', id: 5, peakIndex: 3 },
  { type: 'setRegion', peakIndex: 3, fromPpm: 3.86, toPpm: 3.78 },
  { type: 'setRegion', peakIndex: null, fromPpm: 3.78, toPpm: 3.86 },
  { type: 'cancel' },
];

describe('parseFromWebview', () => {
  it.each(valid)('accepts a well-formed "$type"', (m) => {
    expect(parseFromWebview(m)).toEqual({ ok: true, value: m });
  });

  it.each([
    [{ type: 'requestTile', id: 1, region: { ...region, row1: -1 }, maxRows: 1, maxCols: 1 }, 'region'],
    [{ type: 'requestTile', id: 1, region: { ...region, col0: 6 }, maxRows: 1, maxCols: 1 }, 'region'],
    [{ type: 'requestTile', id: 1, region, maxRows: 0, maxCols: 1 }, 'maxRows'],
    [{ type: 'requestTile', id: 1.5, region, maxRows: 1, maxCols: 1 }, 'id'],
    [{ type: 'measure', id: 1, peakIndex: 0, method: 'guess', dimension: 'F2' }, 'method'],
    [{ type: 'measure', id: 1, peakIndex: 0, method: 'fit', dimension: 'f2' }, 'dimension'],
    [{ type: 'accept', peakIndex: 0, method: 'fit', dimension: 'F2', labels: ['H-1', 3] }, 'labels'],
    [{ type: 'label', pickId: 7, labels: [] }, 'pickId'],
    [{ type: 'removePick' }, 'pickId'],
    [{ type: 'measureAll' }, 'method'],
    [{ type: 'analyse', id: 1, peakIndex: -1 }, 'peakIndex'],
    [{ type: 'analyse', peakIndex: 0 }, 'id'],
    [{ type: 'setRegion', peakIndex: 0.5, fromPpm: 3.86, toPpm: 3.78 }, 'peakIndex'],
    [{ type: 'setRegion', peakIndex: 0, fromPpm: '3.86', toPpm: 3.78 }, 'fromPpm'],
    [{ type: 'setRegion', peakIndex: 0, fromPpm: 3.86, toPpm: Number.NaN }, 'toPpm'],
    [{ type: 'setRegion', peakIndex: 0, fromPpm: 3.86, toPpm: 3.86 }, 'toPpm'],
  ])('names the bad field of %j', (m, field) => {
    expect(parseFromWebview(m)).toEqual({ ok: false, error: `message "${m.type}": field "${field}" is missing or invalid` });
  });

  it('rejects non-objects and unknown types', () => {
    expect(parseFromWebview(null)).toEqual({ ok: false, error: 'message is not an object with a string "type"' });
    expect(parseFromWebview(['ready'])).toEqual({ ok: false, error: 'message is not an object with a string "type"' });
    expect(parseFromWebview({ type: 'eraseAll' })).toEqual({ ok: false, error: 'unknown message type "eraseAll"' });
  });

  it.each(['toString', 'valueOf', 'hasOwnProperty', 'constructor', '__proto__'])('treats the Object.prototype name "%s" as an unknown type (no throw)', (type) => {
    expect(parseFromWebview({ type })).toEqual({ ok: false, error: `unknown message type "${type}"` });
    expect(parseToWebview({ type })).toEqual({ ok: false, error: `unknown message type "${type}"` });
  });
});

describe('parseToWebview', () => {
  it('accepts a tile whose Float32Array holds rows x cols values, and refuses one that does not', () => {
    const tile = { type: 'tile', inReplyTo: 1, region, rows: 2, cols: 3, data: new Float32Array(6) };
    expect(parseToWebview(tile).ok).toBe(true);
    expect(parseToWebview({ ...tile, data: new Float32Array(5) })).toEqual({ ok: false, error: 'message "tile": field "data" is missing or invalid' });
    // JSON numbers are not accepted: the data must arrive as a typed array (structured clone).
    expect(parseToWebview({ ...tile, data: [0, 0, 0, 0, 0, 0] }).ok).toBe(false);
  });

  it('accepts an error with or without the request it answers', () => {
    expect(parseToWebview({ type: 'error', message: 'x' }).ok).toBe(true);
    expect(parseToWebview({ type: 'error', inReplyTo: 2, message: 'x' }).ok).toBe(true);
    expect(parseToWebview({ type: 'error' }).ok).toBe(false);
  });
});

describe('parseToWebview: settings', () => {
  const settings = readSettings(() => undefined);

  it('accepts the settings the host reads (the package.json defaults)', () => {
    expect(parseToWebview({ type: 'settings', settings })).toEqual({ ok: true, value: { type: 'settings', settings } });
  });

  it.each([
    ['a missing settings object', undefined],
    ['a non-integer level count', { ...settings, contours: { ...settings.contours, levels: 2.5 } }],
    ['a NaN lowest level', { ...settings, contours: { ...settings.contours, lowestLevel: Number.NaN } }],
    ['an unknown method', { ...settings, defaultMethod: 'guess' }],
    ['negative J decimals', { ...settings, jDecimals: -1 }],
  ])('refuses %s, naming the field', (_what, bad) => {
    expect(parseToWebview({ type: 'settings', settings: bad })).toEqual({ ok: false, error: 'message "settings": field "settings" is missing or invalid' });
  });
});

describe('parseToWebview: the views the panel reads are checked before use', () => {
  const settings = readSettings(() => undefined);
  const axis = { points: 1024, firstHz: 3000, lastHz: 1800, observeMhz: 600 };
  const spectrum = { fileName: 'cosy.jdx', title: 't', dims: 2, f1: { ...axis, points: 128 }, f2: axis, noise: 0.5, min: -10, max: 12 };
  const peaks = [{ index: 0, kind: 'cross', f2Ppm: 4.2, f1Ppm: 3.85, extent: { f2FromPpm: 4.21, f2ToPpm: 4.19, f1FromPpm: 3.86, f1ToPpm: 3.84 }, partner: null }];
  const sidecar = {
    picks: [{ id: 'p-1', f2Ppm: 4.2, f1Ppm: 3.85, label: ['H-1', 'H-2'], kind: 'cross' }],
    couplings: [{ atoms: ['H-1', 'H-2'], jHz: 7.5, jSdHz: 0.05, method: 'fit', dimension: 'F2', picks: ['p-1'], flags: [] }],
    blocked: null,
  };
  const init = { type: 'init', spectrum, settings, peaks, sidecar, knownLabels: [] };
  const trace = { f1Ppm: 3.85, fromPpm: 4.3, toPpm: 4.1, data: new Float32Array(4), fitted: new Float32Array(4), residual: new Float32Array(4) };
  const measurement = { peakIndex: 0, jHz: 7.5, jSdHz: 0.05, passiveHz: [], linewidthHz: 1.2, method: 'fit', dimension: 'F2', flags: [], notes: [], traces: [trace] };

  it('accepts well-formed init, sidecar, measured and command messages', () => {
    expect(parseToWebview(init).ok).toBe(true);
    expect(parseToWebview({ type: 'sidecar', sidecar }).ok).toBe(true);
    expect(parseToWebview({ type: 'measured', inReplyTo: 3, measurement }).ok).toBe(true);
    expect(parseToWebview({ type: 'command', command: 'nextPeak' }).ok).toBe(true);
  });

  it.each([
    ['init', 'settings', { ...init, settings: { ...settings, jDecimals: 'two' } }],
    ['init', 'spectrum', { ...init, spectrum: { ...spectrum, f1: undefined } }],
    ['init', 'spectrum', { ...init, spectrum: { ...spectrum, f2: { ...axis, observeMhz: 0 } } }],
    ['init', 'peaks', { ...init, peaks: [{ ...peaks[0], kind: 'ghost' }] }],
    ['init', 'sidecar', { ...init, sidecar: { ...sidecar, picks: [{ id: 'p-1', label: [] }] } }],
    ['sidecar', 'sidecar', { type: 'sidecar', sidecar: { picks: [], blocked: null } }],
    ['sidecar', 'sidecar', { type: 'sidecar', sidecar: { ...sidecar, couplings: [{ ...sidecar.couplings[0], atoms: ['H-1'] }] } }],
    ['measured', 'measurement', { type: 'measured', inReplyTo: 3, measurement: { ...measurement, jHz: '7.5' } }],
    ['measured', 'measurement', { type: 'measured', inReplyTo: 3, measurement: { ...measurement, traces: [{ ...trace, data: [0, 0, 0, 0] }] } }],
    ['command', 'command', { type: 'command', command: 'formatDisk' }],
  ])('refuses a "%s" message whose "%s" the panel would misread', (type, field, m) => {
    expect(parseToWebview(m)).toEqual({ ok: false, error: `message "${type}": field "${field}" is missing or invalid` });
  });
});

describe('parseToWebview: the 1D multiplet analysis', () => {
  const analysis = {
    peakIndex: 2, pickId: 'p-3.8200', label: ['H-4'], centrePpm: 3.82, fromPpm: 3.848, toPpm: 3.793, regionSet: true,
    integral: 1388.2, protons: 1.02, reference: 'reference p-1.1700 (H-7) = 3 H', multiplicity: 'tt',
    couplings: [{ jHz: 11.17, sdHz: 0.02, count: 2 }, { jHz: 4.53, sdHz: 0.02, count: 2 }], flags: [], notes: [],
    cosy: [{ partner: 'H-3b', cosyJHz: 4.5, cosySdHz: 0.05, oneDJHz: 4.53, oneDSdHz: 0.02, agrees: true }], partners: ['H-3b'],
    linesPpm: [3.84, 3.83], fitted: { fromPpm: 3.848, toPpm: 3.793, data: new Float32Array(3) },
  };

  it('accepts a well-formed analysis, also without a reference, pick or fit', () => {
    expect(parseToWebview({ type: 'analysed', inReplyTo: 1, analysis }).ok).toBe(true);
    expect(parseToWebview({ type: 'analysed', inReplyTo: 1, analysis: { ...analysis, protons: null, pickId: null, fitted: null } }).ok).toBe(true);
  });

  it.each([
    ['a J given as text', { ...analysis, couplings: [{ jHz: '11.17', sdHz: 0.02, count: 2 }] }],
    ['a count of 0 equivalent partners', { ...analysis, couplings: [{ jHz: 11.17, sdHz: 0.02, count: 0 }] }],
    ['a fitted curve sent as JSON numbers', { ...analysis, fitted: { fromPpm: 3.8, toPpm: 3.7, data: [1, 2] } }],
    ['a COSY check without its verdict', { ...analysis, cosy: [{ ...analysis.cosy[0], agrees: undefined }] }],
    ['no region flag', { ...analysis, regionSet: undefined }],
  ])('refuses %s', (_what, bad) => {
    expect(parseToWebview({ type: 'analysed', inReplyTo: 1, analysis: bad })).toEqual({ ok: false, error: 'message "analysed": field "analysis" is missing or invalid' });
  });

  it('reads a pick\'s region and reference in the sidecar view, and refuses a region given as text', () => {
    const pick = { id: 'p-1', f2Ppm: 1.17, label: ['H-7'], kind: 'multiplet', fromPpm: 1.18, toPpm: 1.16, protons: 3 };
    expect(parseToWebview({ type: 'sidecar', sidecar: { picks: [pick], couplings: [], blocked: null } }).ok).toBe(true);
    expect(parseToWebview({ type: 'sidecar', sidecar: { picks: [{ ...pick, fromPpm: '1.18' }], couplings: [], blocked: null } }).ok).toBe(false);
  });
});
