/**
 * JCAMP-DX read/write speed on a 2048 x 1024 2D spectrum (the size a DQF-COSY is commonly
 * processed to), as ratios against a baseline measured in the same run: one pass over the text's
 * char codes (the least any reader must do). Run by bench/index.ts (`npm run bench`).
 */
import { parseJcamp, writeJcamp2D } from '../src/core/jcamp';
import { makeAxis } from '../src/core/spectrum/axis';
import { make2D, type Spectrum2D } from '../src/core/spectrum/spectrum';
import { best, scanText } from './timing';

export interface JcampBenchRow {
  readonly name: string;
  readonly megabytes: number;
  /** Best of the repeats, ms. */
  readonly ms: number;
  /** ms over the baseline scan of the same text. */
  readonly ratio: number;
}

function demoSpectrum(n1: number, n2: number): Spectrum2D {
  const data = new Float64Array(n1 * n2);
  let seed = 12345;
  const rnd = (): number => {
    seed = (seed * 1103515245 + 12345) % 2147483648; // LCG (glibc constants), only for reproducible noise
    return seed / 2147483648 - 0.5;
  };
  for (let r = 0; r < n1; r++) {
    for (let c = 0; c < n2; c++) {
      const peak = Math.exp(-((c - 700) ** 2) / 50) * Math.exp(-((r - 300) ** 2) / 50);
      data[r * n2 + c] = peak + 1e-3 * rnd();
    }
  }
  return make2D('bench', data, makeAxis(n1, 3000, 0, 600.13), makeAxis(n2, 3000.5, -0.2, 600.13));
}



export function runJcampBench(repeats = 5): JcampBenchRow[] {
  const s = demoSpectrum(1024, 2048);
  const rows: JcampBenchRow[] = [];
  for (const encoding of ['DIFDUP', 'AFFN'] as const) {
    let text = '';
    const writeMs = best(2, () => (text = writeJcamp2D(s, { encoding })));
    const baseline = best(repeats, () => scanText(text));
    const readMs = best(repeats, () => parseJcamp(text, 'bench.jdx'));
    const mb = text.length / 1e6;
    rows.push({ name: `read 2D ${encoding}`, megabytes: mb, ms: readMs, ratio: readMs / baseline });
    rows.push({ name: `write 2D ${encoding}`, megabytes: mb, ms: writeMs, ratio: writeMs / baseline });
  }
  return rows;
}

