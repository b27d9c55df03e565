import type { Spectrum2D } from '../spectrum/spectrum';
import { measureCrossPeak } from './index';
import type { CrossPeakInput, Measurement, MeasureOptions, QualityFlag } from './types';

/** What the symmetric cross peak gave on its own. */
export interface PartnerResult {
  jHz: number;
  jSdHz: number;
  flags: QualityFlag[];
}

/**
 * A measurement reconciled with the symmetric cross peak. jHz / jSdHz are the reconciled values;
 * ownJHz / ownJSdHz what this cross peak alone gave; partner is null when it could not be measured.
 */
export interface PairMeasurement extends Measurement {
  ownJHz: number;
  ownJSdHz: number;
  partner: PartnerResult | null;
}

/** Agreement within this many combined standard deviations counts as agreement (common practice: 3σ). */
const AGREE_SIGMAS = 3;
/** Partner multiplicities tried: CH2 and CH3 groups. */
const MULTIPLES = [2, 3];

export interface Reconciled {
  jHz: number;
  jSdHz: number;
  flag: QualityFlag | null;
  note: string;
}

function agree(a: number, sa: number, b: number, sb: number): boolean {
  return Math.abs(a - b) <= AGREE_SIGMAS * Math.hypot(sa, sb);
}

/**
 * Reconciles two readings of one coupling. Equal within 3σ: inverse-variance weighted mean. One ≈ n
 * times the other (n = 2, 3): the trace of the proton coupled to n equivalent protons has its inner
 * lines cancel, so it shows an antiphase pair at n J (sin(πJt) cos^(n-1)(πJt); DQF-COSY product-operator
 * result, e.g. Keeler, Understanding NMR Spectroscopy, ch. 8 [mem]); the smaller reading is J.
 */
export function reconcile(own: number, ownSd: number, other: number, otherSd: number): Reconciled {
  if (agree(own, ownSd, other, otherSd)) {
    const wa = 1 / Math.max(ownSd, 1e-12) ** 2;
    const wb = 1 / Math.max(otherSd, 1e-12) ** 2;
    return {
      jHz: (wa * own + wb * other) / (wa + wb), jSdHz: 1 / Math.sqrt(wa + wb), flag: null,
      note: `consistent: the symmetric cross peak gives ${other.toFixed(2)} ± ${otherSd.toFixed(2)} Hz; J is the inverse-variance weighted mean of both.`,
    };
  }
  for (const n of MULTIPLES) {
    const [small, smallSd, large, largeSd] = own < other ? [own, ownSd, other, otherSd] : [other, otherSd, own, ownSd];
    if (agree(large, largeSd, n * small, n * smallSd)) {
      const which = own < other ? 'the symmetric cross peak' : 'this cross peak';
      return {
        jHz: small, jSdHz: smallSd, flag: 'equivalent_partner',
        note: `The symmetric cross peak gives ${other.toFixed(2)} Hz against ${own.toFixed(2)} Hz here, about ${n} times: the trace of ` +
          `${which} is split by ${n} equivalent protons (a CH${n} group) with the same J, its inner lines cancel and it shows ${n}J. ` +
          `J is the smaller reading, ${small.toFixed(2)} Hz.`,
      };
    }
  }
  return {
    jHz: own, jSdHz: ownSd, flag: 'partner_disagrees',
    note: `The symmetric cross peak gives ${other.toFixed(2)} ± ${otherSd.toFixed(2)} Hz, which neither agrees with ${own.toFixed(2)} Hz ` +
      'here nor is a multiple of 2 or 3; overlap or a second-order effect is likely. This peak\'s own value is reported.',
  };
}

/**
 * J at a cross peak checked against its symmetric partner (the same coupling seen from the other
 * proton). When the partner cannot be measured, the result is this peak's own, with partner null.
 */
export function measurePair(s: Spectrum2D, peak: CrossPeakInput, partner: CrossPeakInput, opts: MeasureOptions = {}): PairMeasurement {
  const own = measureCrossPeak(s, peak, opts);
  const base: PairMeasurement = { ...own, ownJHz: own.jHz, ownJSdHz: own.jSdHz, partner: null };
  let other: Measurement;
  try {
    other = measureCrossPeak(s, partner, opts);
  } catch (e) {
    if (e instanceof Error && e.name === 'MeasureError') {
      return { ...base, notes: [...own.notes, `The symmetric cross peak could not be measured: ${e.message}`] };
    }
    throw e;
  }
  const r = reconcile(own.jHz, own.jSdHz, other.jHz, other.jSdHz);
  const flags = r.flag ? [...own.flags, r.flag] : [...own.flags];
  return {
    ...base, jHz: r.jHz, jSdHz: r.jSdHz, flags, notes: [...own.notes, r.note],
    partner: { jHz: other.jHz, jSdHz: other.jSdHz, flags: [...other.flags] },
  };
}
