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
