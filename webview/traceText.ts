/**
 * The plain-text part of the trace view: J with its standard deviation, method, dimension,
 * passive couplings, linewidth, flags and notes, and a caution line when any flag is set. Pure.
 */
import type { MeasurementView } from '../src/protocol';

export function measurementLines(m: MeasurementView, jDecimals: number): string[] {
  const hz = (v: number): string => v.toFixed(jDecimals);
  const lines = [
    `J = ${hz(m.jHz)} ± ${hz(m.jSdHz)} Hz   (${m.method === 'fit' ? 'model fit' : 'peak separation'}, ${m.dimension})`,
    `passive: ${m.passiveHz.length ? m.passiveHz.map(hz).join(', ') + ' Hz' : 'none'}   linewidth: ${hz(m.linewidthHz)} Hz`,
  ];
  if (m.flags.length > 0) {
    lines.push(`flags: ${m.flags.join(', ')}`);
    lines.push('Caution: check this value before accepting it (see the flags above).');
  }
  for (const n of m.notes) lines.push(`note: ${n}`);
  return lines;
}
