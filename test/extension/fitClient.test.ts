/**
 * The worker and its client: a real worker_threads worker running the bundled fitWorker.ts
 * (esbuild, as scripts/build.mjs does), and a fake worker for the request/reply bookkeeping.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { build } from 'esbuild';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseJcamp, writeJcamp2D } from '../../src/core/jcamp';
import { compoundSi } from '../../src/extension/notes/compoundSi';
import { measureCrossPeak } from '../../src/core/measure';
import { CancelledError, FitClient, FitFailedError, type WorkerLike } from '../../src/extension/fitClient';
import type { FromWorker, ToWorker } from '../../src/extension/workerMessages';
import { analyseMultiplet } from '../../src/core/report/multiplet';
import { testModel } from './fixture';
import { multipletAt, testModel1D } from './fixture1D';

let dir = '';
let workerFile = '';
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'couplet-worker-'));
  workerFile = join(dir, 'fitWorker.js');
  await build({ entryPoints: [join(__dirname, '..', '..', 'src', 'extension', 'fitWorker.ts')], outfile: workerFile, bundle: true, platform: 'node', format: 'cjs', logLevel: 'error' });
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function spectrumTransfer() {
  const s = testModel().spectrum;
  if (s.dims !== 2) throw new Error('fixture is 2D');
  return { title: s.title, data: s.data, f1: s.f1, f2: s.f2, ...(s.processing && { processing: s.processing }) };
}

describe('FitClient with the real worker', () => {
  it('analyses a 1D multiplet in the worker exactly as in-process, and reports a region too narrow as expected (not a bug)', async () => {
    const m = testModel1D();
    const s = m.spectrum;
    const k = m.multiplets[multipletAt(m, 1.2)];
    if (s.dims !== 1 || !k) throw new Error('fixture is 1D');
    const client = new FitClient(() => new Worker(workerFile), { dims: 1, spectrum: { title: s.title, data: s.data, axis: s.axis, ...(s.processing && { processing: s.processing }) } });
    try {
      const remote = await client.analyse(k.fromPpm, k.toPpm, {});
      const local = analyseMultiplet(s, k.fromPpm, k.toPpm, {});
      expect(remote.couplings).toEqual(local.couplings);
      expect(remote.integral).toBe(local.integral);
      expect(remote.fit?.model).toEqual(local.fit?.model);
      await expect(client.analyse(1.2, 1.20001, {})).rejects.toBeInstanceOf(FitFailedError);
    } finally {
      client.dispose();
    }
  });

  it('returns the same measurement as measureCrossPeak in-process (same input, deterministic fit)', async () => {
    const m = testModel();
    const peak = m.crossPeaks[1];
    if (!peak || m.spectrum.dims !== 2) throw new Error('fixture has a cross peak');
    const client = new FitClient(() => new Worker(workerFile), spectrumTransfer());
    try {
      const remote = await client.measure(peak, { method: 'fit', dimension: 'F2', noise: m.noise });
      const local = measureCrossPeak(m.spectrum, peak, { method: 'fit', dimension: 'F2', noise: m.noise });
      expect(remote.jHz).toBe(local.jHz);
      expect(remote.jSdHz).toBe(local.jSdHz);
      expect(remote.flags).toEqual(local.flags);
      expect(client.inFlight).toBe(0);
    } finally {
      client.dispose();
    }
  });

  it('rejects a pending fit with CancelledError on cancel, then works again with a fresh worker', async () => {
    const m = testModel();
    const peak = m.crossPeaks[1];
    if (!peak) throw new Error('fixture has a cross peak');
    let spawned = 0;
    const client = new FitClient(() => (spawned++, new Worker(workerFile)), spectrumTransfer());
    try {
      const first = client.measure(peak, { method: 'fit', noise: m.noise });
      client.cancel();
      await expect(first).rejects.toBeInstanceOf(CancelledError);
      expect(client.inFlight).toBe(0);
      const again = await client.measure(peak, { method: 'naive', noise: m.noise });
      expect(again.method).toBe('naive');
      expect(spawned).toBe(2);
    } finally {
      client.dispose();
    }
  });

  it('reports a measurement that cannot be made as FitFailedError with the core message', async () => {
    const client = new FitClient(() => new Worker(workerFile), spectrumTransfer());
    try {
      // A window of 3 points at 3.0 ppm, away from both spins of fixture.ts: too narrow to fit.
      const nowhere = { f2Ppm: 3.0, f1Ppm: 3.0, extent: { f1FromPpm: 3.01, f1ToPpm: 2.99, f2FromPpm: 3.01, f2ToPpm: 2.99, row0: 60, row1: 62, col0: 500, col1: 502 } };
      const e: unknown = await client.measure(nowhere, { method: 'fit', noise: testModel().noise }).catch((x: unknown) => x);
      // The core's MeasureError arrives as FitFailedError with its message (not as a worker crash).
      expect(e).toBeInstanceOf(FitFailedError);
      expect(String(e)).toBe('FitFailedError: window in F2 at 3.0000 ppm has fewer than 6 points');
    } finally {
      client.dispose();
    }
  });

  it('opens a JCAMP-DX text in the worker: same peaks as in-process, data in shared memory', async () => {
    const m = testModel();
    if (m.spectrum.dims !== 2) throw new Error('fixture is 2D');
    const text = writeJcamp2D(m.spectrum);
    const client = new FitClient(() => new Worker(workerFile), null);
    try {
      const r = await client.open(text, 'cosy.jdx');
      expect(r.spectrum.data.buffer).toBeInstanceOf(SharedArrayBuffer);
      expect(r.crossPeaks.map((p) => [p.kind, p.f2Ppm.toFixed(3), p.f1Ppm.toFixed(3)])).toEqual(m.crossPeaks.map((p) => [p.kind, p.f2Ppm.toFixed(3), p.f1Ppm.toFixed(3)]));
      const damaged = text.replace(/##\.OBSERVE FREQUENCY=[^\n]*\n/, '');
      await expect(client.open(damaged, 'bad.jdx')).rejects.toThrow(FitFailedError);
      await expect(client.open(damaged, 'bad.jdx')).rejects.toThrow(/^bad\.jdx/);
    } finally {
      client.dispose();
    }
  });

  it('computes a compound report in the worker with the same SI line as in-process, and says why when there is no sidecar', async () => {
    const dirOf = join(__dirname, '..', '..', 'samples', 'brisquarene');
    const s = parseJcamp(readFileSync(join(dirOf, '1h.jdx'), 'latin1'), '1h.jdx');
    if (s.dims !== 1) throw new Error('sample 1h.jdx is 1D');
    const sidecars = ['1h.jdx.couplet.yaml', 'cosy.jdx.couplet.yaml'].map((f) => ({ fileName: f, text: readFileSync(join(dirOf, f), 'utf8') }));
    const input = { compound: 'brisquarene', sidecars, solvent: 'CDCl3', noteLabels: [], spectrum1DFile: '1h.jdx' };
    const here = compoundSi({ ...input, spectrum1D: s });
    const client = new FitClient(() => new Worker(workerFile), null);
    try {
      const transfer = { title: s.title, data: s.data, axis: s.axis, ...(s.processing && { processing: s.processing }), key: '1h.jdx@1' };
      const there = await client.compound({ ...input, spectrum1D: transfer });
      expect(there.siLine).toEqual(here.siLine);
      expect(there.notes).toEqual(here.notes);
      await expect(client.compound({ ...input, sidecars: [] })).rejects.toThrow(/no readable sidecar \(\*\.couplet\.yaml\) beside the brisquarene note/);
    } finally {
      client.dispose();
    }
  });
});

/** A worker that answers only when told to, so the order of replies can be chosen. */
class FakeWorker implements WorkerLike {
  sent: ToWorker[] = [];
  terminated = false;
  private listeners: Record<string, ((v: never) => void)[]> = {};
  postMessage(m: ToWorker): void {
    this.sent.push(m);
  }
  on(event: string, listener: (v: never) => void): this {
    (this.listeners[event] ??= []).push(listener);
    return this;
  }
  emit(event: 'message' | 'error' | 'exit', v: FromWorker | Error | number): void {
    for (const l of this.listeners[event] ?? []) (l as (x: typeof v) => void)(v);
  }
  terminate(): void {
    this.terminated = true;
  }
}

const fakeMeasurement = (jHz: number) => ({ jHz }) as unknown as import('../../src/core/measure').Measurement;
const peakAt = { f2Ppm: 1, f1Ppm: 2 };

describe('FitClient bookkeeping (fake worker)', () => {
  it('loads the spectrum first, then matches replies to requests by id, in any order', async () => {
    const w = new FakeWorker();
    const client = new FitClient(() => w, spectrumTransfer());
    const a = client.measure(peakAt, {});
    const b = client.measure(peakAt, {});
    expect(w.sent.map((m) => m.type)).toEqual(['load', 'measure', 'measure']);
    const ids = w.sent.flatMap((m) => (m.type === 'measure' ? [m.id] : []));
    w.emit('message', { type: 'measured', inReplyTo: ids[1] ?? -1, measurement: fakeMeasurement(2) });
    w.emit('message', { type: 'measured', inReplyTo: ids[0] ?? -1, measurement: fakeMeasurement(1) });
    expect((await a).jHz).toBe(1);
    expect((await b).jHz).toBe(2);
  });

  it('shares the spectrum data with the worker instead of copying it per worker', () => {
    const w = new FakeWorker();
    const client = new FitClient(() => w, spectrumTransfer());
    void client.measure(peakAt, {}).catch(() => undefined);
    const load = w.sent[0];
    expect(load?.type === 'load' && load.spectrum.data.buffer instanceof SharedArrayBuffer).toBe(true);
    client.dispose();
  });

  it('rejects everything pending when the worker exits, and ignores a stopped worker afterwards', async () => {
    const w = new FakeWorker();
    const client = new FitClient(() => w, null);
    const a = client.measure(peakAt, {});
    w.emit('exit', 1);
    await expect(a).rejects.toThrow('the fit worker stopped unexpectedly (exit code 1)');
    w.emit('message', { type: 'measured', inReplyTo: 1, measurement: fakeMeasurement(1) });
    expect(client.inFlight).toBe(0);
  });

  it('terminates the worker on dispose', async () => {
    const w = new FakeWorker();
    const client = new FitClient(() => w, null);
    const a = client.measure(peakAt, {});
    client.dispose();
    expect(w.terminated).toBe(true);
    await expect(a).rejects.toThrow('the spectrum panel was closed');
  });

  it('starts no new worker after dispose: a late request (a message from a closing panel) is refused', async () => {
    let spawned = 0;
    const client = new FitClient(() => (spawned++, new FakeWorker()), null);
    client.dispose();
    await expect(client.measure(peakAt, {})).rejects.toBeInstanceOf(CancelledError);
    expect(spawned).toBe(0);
    expect(client.inFlight).toBe(0);
  });
  it('keeps the worker when cancel finds nothing to cancel (Esc in the panel also ends a box zoom)', async () => {
    let spawned = 0;
    const w = new FakeWorker();
    const client = new FitClient(() => (spawned++, w), null);
    const a = client.measure(peakAt, {});
    const id = w.sent.find((m) => m.type === 'measure');
    w.emit('message', { type: 'measured', inReplyTo: id?.type === 'measure' ? id.id : -1, measurement: fakeMeasurement(1) });
    await a;
    client.cancel();
    expect(w.terminated).toBe(false);
    void client.measure(peakAt, {}).catch(() => undefined);
    expect(spawned).toBe(1);
    client.dispose();
  });
});
