/** The core's Measurement as the panel shows it: traces as Float32Array (sent by structured clone, not JSON). */
import type { Measurement } from '../core/measure';
import type { MeasurementView } from '../protocol';
import type { CouplingValues } from './sidecarActions';

export function measurementView(peakIndex: number, m: Measurement): MeasurementView {
  return {
    peakIndex, jHz: m.jHz, jSdHz: m.jSdHz, passiveHz: [...m.passiveHz], linewidthHz: m.linewidthHz,
    method: m.method, dimension: m.dimension, flags: [...m.flags], notes: [...m.notes],
    traces: m.traces.map((t) => ({
      f1Ppm: t.f1Ppm, fromPpm: t.fromPpm, toPpm: t.toPpm,
      data: Float32Array.from(t.data), fitted: Float32Array.from(t.fitted), residual: Float32Array.from(t.residual),
    })),
  };
}

/** What the sidecar records of a measurement. */
export function couplingValues(m: Measurement): CouplingValues {
  return {
    jHz: m.jHz, jSdHz: m.jSdHz, method: m.method, dimension: m.dimension, flags: [...m.flags],
    passiveHz: [...m.passiveHz], linewidthHz: m.linewidthHz,
  };
}
