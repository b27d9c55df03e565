/**
 * The same coupling measured more than once (both cross peaks, F2 and F1, the 1D multiplet, in
 * one sidecar or in several of one compound) must agree within the combined uncertainty. The
 * rule itself is the coupling network's (src/core/network: |J1| and |J2| within AGREE_SIGMAS
 * combined sd, naive values left out), so check, report and panel say the same; this file adds
 * the file:line of each reading.
 */
import { agree, AGREE_SIGMAS } from '../../network/network';
import { toFixedDecimal } from '../../sidecar/decimal';
import type { Coupling } from '../../sidecar/types';
import type { CheckedSidecar } from './sidecarRules';
import type { Problem } from './types';

export const AGREEMENT_SIGMAS = AGREE_SIGMAS;

interface Reading {
  readonly c: Coupling;
  readonly file: string;
  readonly at: { line: number; column: number };
}

/** Naive peak distances are kept for comparison only (they overestimate small J by design). */
const comparable = (c: Coupling): boolean => c.method !== 'naive';

export function repeatedJRule(sidecars: readonly CheckedSidecar[]): Problem[] {
  const byPair = new Map<string, Reading[]>();
  for (const s of sidecars) {
    for (const c of s.sidecar?.couplings ?? []) {
      if (!comparable(c)) continue;
      const key = c.atoms.join('\u0000');
      const list = byPair.get(key) ?? [];
      list.push({ c, file: s.input.file, at: s.lines.coupling(c) });
      byPair.set(key, list);
    }
  }
  const out: Problem[] = [];
  for (const readings of byPair.values()) {
    readings.forEach((b, i) => {
      for (const a of readings.slice(0, i)) {
        if (agree({ jHz: a.c.jHz, sdHz: a.c.jSdHz }, { jHz: b.c.jHz, sdHz: b.c.jSdHz })) continue;
        const diff = Math.abs(Math.abs(a.c.jHz) - Math.abs(b.c.jHz));
        const sd = Math.hypot(a.c.jSdHz, b.c.jSdHz);
        const j = (c: Coupling): string => `${toFixedDecimal(c.jHz, 2)} ± ${toFixedDecimal(c.jSdHz, 2)} Hz (${c.method} ${c.dimension})`;
        out.push({ ...b.at, file: b.file, severity: 'warning', rule: 'repeated-j',
          message: `J(${b.c.atoms.join(',')}) = ${j(b.c)} disagrees with ${j(a.c)} at ${a.file}:${a.at.line}: `
            + `difference ${toFixedDecimal(diff, 2)} Hz > ${AGREEMENT_SIGMAS} x combined sigma ${toFixedDecimal(sd, 2)} Hz` });
      }
    });
  }
  return out;
}
