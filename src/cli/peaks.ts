import { pickCrossPeaks, pickMultiplets1D } from '../core/peaks';
import type { Spectrum } from '../core/spectrum/spectrum';
import { fixed, formatTable, round } from './table';

export interface CrossPeakJson {
  f2_ppm: number;
  f1_ppm: number;
  kind: 'cross' | 'diagonal';
  height: number;
  partner: number | null;
}

export interface MultipletJson {
  ppm: number;
  from_ppm: number;
  to_ppm: number;
  height: number;
}

export type PeaksJson =
  | { file: string; dims: 2; noise: number; peaks: CrossPeakJson[] }
  | { file: string; dims: 1; noise: number; peaks: MultipletJson[] };

export function peaks(file: string, s: Spectrum, threshold: number | undefined): PeaksJson {
  const opts = threshold === undefined ? {} : { threshold };
  if (s.dims === 2) {
    const r = pickCrossPeaks(s, opts);
    return {
      file,
      dims: 2,
      noise: round(r.noise, 6),
      peaks: r.peaks.map((p) => ({
        f2_ppm: round(p.f2Ppm, 5),
        f1_ppm: round(p.f1Ppm, 5),
        kind: p.kind,
        height: round(p.height, 6),
        partner: p.partner,
      })),
    };
  }
  const r = pickMultiplets1D(s, opts);
  return {
    file,
    dims: 1,
    noise: round(r.noise, 6),
    peaks: r.multiplets.map((m) => ({ ppm: round(m.ppm, 5), from_ppm: round(m.fromPpm, 5), to_ppm: round(m.toPpm, 5), height: round(m.height, 6) })),
  };
}

export function peaksText(p: PeaksJson): string {
  const head = `${p.file}: ${p.peaks.length} ${p.dims === 2 ? 'peaks' : 'multiplets'} (noise sigma ${p.noise.toPrecision(3)})\n`;
  if (p.dims === 2) {
    const rows = p.peaks.map((q, i) => [
      String(i),
      fixed(q.f2_ppm, 4),
      fixed(q.f1_ppm, 4),
      q.kind,
      (q.height / p.noise).toFixed(0),
      q.partner === null ? '-' : String(q.partner),
    ]);
    return head + formatTable(['#', 'F2 ppm', 'F1 ppm', 'kind', 'height/noise', 'partner'], rows);
  }
  const rows = p.peaks.map((m, i) => [String(i), fixed(m.ppm, 4), `${fixed(m.from_ppm, 4)} .. ${fixed(m.to_ppm, 4)}`, (m.height / p.noise).toFixed(0)]);
  return head + formatTable(['#', 'ppm', 'range ppm', 'height/noise'], rows);
}
