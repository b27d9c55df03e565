import type { WindowFunction } from '../spectrum/processing';

/**
 * Window (apodization) values for n acquired points at dwell time 1/swHz.
 * Sine bell: sin(phi + (pi - phi) k / (n - 1)), phi = shift; shift 90 deg gives a cosine bell, and
 * power 2 the squared (cosine) bell common for DQF-COSY (common practice).
 */
export function windowValues(w: WindowFunction, n: number, swHz: number): Float64Array {
  const out = new Float64Array(n);
  switch (w.kind) {
    case 'none':
      out.fill(1);
      return out;
    case 'exponential':
      for (let k = 0; k < n; k++) out[k] = Math.exp((-Math.PI * w.lbHz * k) / swHz);
      return out;
    case 'sine': {
      const phi = (w.shiftDeg * Math.PI) / 180;
      const span = n > 1 ? n - 1 : 1;
      for (let k = 0; k < n; k++) {
        const s = Math.sin(phi + ((Math.PI - phi) * k) / span);
        out[k] = w.power === 2 ? s * s : s;
      }
      return out;
    }
  }
}

export function describeWindow(w: WindowFunction): string {
  switch (w.kind) {
    case 'none':
      return 'none';
    case 'exponential':
      return `exponential ${w.lbHz} Hz`;
    case 'sine':
      return `${w.power === 2 ? 'squared sine' : 'sine'} bell, shift ${w.shiftDeg} deg`;
  }
}
