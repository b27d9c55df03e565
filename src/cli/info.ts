import { firstPpm, lastPpm, type Axis } from '../core/spectrum/axis';
import type { DimensionProcessing } from '../core/spectrum/processing';
import type { Spectrum } from '../core/spectrum/spectrum';
import { describeWindow } from '../core/simulate/window';
import { fixed, formatTable, round } from './table';

interface AxisInfo {
  dimension: 'indirect' | 'direct';
  points: number;
  first_ppm: number;
  last_ppm: number;
  first_hz: number;
  last_hz: number;
  hz_per_point: number;
  processing: string | null;
}

export interface InfoJson {
  file: string;
  title: string;
  dims: 1 | 2;
  observe_mhz: number;
  axes: AxisInfo[];
}

function axisInfo(dimension: AxisInfo['dimension'], a: Axis, p: DimensionProcessing | undefined): AxisInfo {
  return {
    dimension,
    points: a.points,
    first_ppm: round(firstPpm(a), 6),
    last_ppm: round(lastPpm(a), 6),
    first_hz: round(a.firstHz, 4),
    last_hz: round(a.lastHz, 4),
    hz_per_point: round(Math.abs(a.lastHz - a.firstHz) / (a.points - 1), 6),
    processing: p ? `${describeWindow(p.window)}; ${p.acquiredPoints} points acquired, AQ ${(p.acquiredPoints / p.spectralWidthHz).toFixed(4)} s, zero-filled to ${p.size}` : null,
  };
}

/** Axes from the slowest to the direct (acquisition) dimension, as design.md specifies. */
export function info(file: string, s: Spectrum): InfoJson {
  const axes =
    s.dims === 2
      ? [axisInfo('indirect', s.f1, s.processing?.f1), axisInfo('direct', s.f2, s.processing?.f2)]
      : [axisInfo('direct', s.axis, s.processing)];
  const observe = s.dims === 2 ? s.f2.observeMhz : s.axis.observeMhz;
  return { file, title: s.title, dims: s.dims, observe_mhz: observe, axes };
}

export function infoText(i: InfoJson): string {
  const head = `${i.file}: ${i.dims}D, ${i.title || '(no title)'}, observe ${i.observe_mhz} MHz\n`;
  const rows = i.axes.map((a) => [
    a.dimension === 'direct' ? 'F2 (direct)' : 'F1 (indirect)',
    String(a.points),
    `${fixed(a.first_ppm, 4)} .. ${fixed(a.last_ppm, 4)}`,
    `${fixed(a.first_hz, 2)} .. ${fixed(a.last_hz, 2)}`,
    fixed(a.hz_per_point, 3),
    a.processing ?? 'not recorded',
  ]);
  return head + formatTable(['axis', 'points', 'ppm', 'Hz', 'Hz/point', 'processing'], rows);
}
