/**
 * "Measure all": every cross peak of a spectrum, one after the other in the fit worker, with
 * progress, a cancel button, and Esc in the panel. The values go to the output channel (and the
 * panel's cache, ready to accept); nothing is written to the sidecar. Split from panelSession.ts.
 */
import type { Measurement } from '../core/measure';
import type { CrossPeak } from '../core/peaks';
import type { ProgressMessage } from '../protocol';
import { CancelledError } from './fitClient';
import type { SessionPorts } from './panelSession';

export interface MeasureAllSummary {
  readonly measured: number;
  readonly failed: readonly string[];
  readonly cancelled: boolean;
}

export interface Batch {
  readonly fileName: string;
  readonly crossPeaks: readonly CrossPeak[];
  /** Measures one peak (or reuses the panel's earlier measurement of it). */
  measure(index: number): Promise<Measurement>;
  /** Stops the fit in flight. */
  cancelFits(): void;
  /** True once the batch must end: Esc in the panel, or the panel closed. */
  stopped(): boolean;
  post(m: ProgressMessage): void;
  readonly ports: Pick<SessionPorts, 'withProgress' | 'log' | 'inform'>;
}

const describe = (e: unknown): string => (e instanceof Error ? e.message : String(e));

function logLine(b: Batch, i: number, r: Measurement): string {
  const p = b.crossPeaks[i];
  return `${b.fileName} peak ${i} (F2 ${p?.f2Ppm.toFixed(4)} / F1 ${p?.f1Ppm.toFixed(4)} ppm): `
    + `J = ${r.jHz.toFixed(2)} ± ${r.jSdHz.toFixed(2)} Hz, ${r.method} ${r.dimension}${r.flags.length ? `, flags: ${r.flags.join(', ')}` : ''}`;
}

export async function measureAll(b: Batch): Promise<MeasureAllSummary> {
  const indices = b.crossPeaks.flatMap((p, i) => (p.kind === 'cross' ? [i] : []));
  const total = indices.length;
  const failed: string[] = [];
  let measured = 0;
  const cancelled = await b.ports.withProgress(`Measuring ${total} cross peaks in ${b.fileName}`, async (report, token) => {
    token.onCancel(() => b.cancelFits());
    for (const [n, i] of indices.entries()) {
      if (token.cancelled || b.stopped()) return true;
      report(n, total);
      b.post({ type: 'progress', task: 'measureAll', done: n, total });
      try {
        b.ports.log(logLine(b, i, await b.measure(i)));
        measured++;
      } catch (e) {
        if (e instanceof CancelledError) return true;
        failed.push(`peak ${i}: ${describe(e)}`);
      }
    }
    b.post({ type: 'progress', task: 'measureAll', done: total, total });
    return false;
  });
  for (const f of failed) b.ports.log(`${b.fileName} ${f}`);
  b.ports.inform(`${b.fileName}: ${measured} of ${total} cross peaks measured`
    + `${failed.length ? `, ${failed.length} failed` : ''}${cancelled ? ' (cancelled)' : ''}; values in the Couplet output, ready to accept.`);
  return { measured, failed, cancelled };
}
