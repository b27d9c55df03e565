/**
 * What the host knows about the sidecar text at one moment: the view the panel draws, the
 * diagnostics for the Problems panel, and whether it may be written. Pure; recomputed on every
 * change of the sidecar document (edit, undo, revert, checkout).
 */
import { isWritable, parseSidecar, type Sidecar, type SidecarDiagnostic } from '../core/sidecar';
import type { SidecarView } from '../protocol';

export interface SidecarState {
  readonly view: SidecarView;
  readonly diagnostics: readonly SidecarDiagnostic[];
  /** The parsed sidecar, or null when there is none yet or it cannot be read. */
  readonly sidecar: Sidecar | null;
  /** True when there is no file yet (the first pick creates it). */
  readonly missing: boolean;
}

const EMPTY: SidecarView = { picks: [], couplings: [], blocked: null };

/** Blank text counts as "no sidecar yet" (e.g. a file created empty by a checkout or a revert). */
export function isBlank(text: string | null): boolean {
  return text === null || text.trim() === '';
}

export function sidecarState(text: string | null, fileName: string, dataSha256: string): SidecarState {
  if (text === null || isBlank(text)) return { view: EMPTY, diagnostics: [], sidecar: null, missing: true };
  const { sidecar, diagnostics } = parseSidecar(text, fileName, { dataSha256 });
  const blocking = diagnostics.find((d) => d.severity === 'error');
  const blocked = !isWritable(diagnostics) || sidecar === null
    ? `${blocking?.message ?? `${fileName} cannot be read as a sidecar`} — fix the file; Couplet will not write it until then.`
    : null;
  const view: SidecarView = {
    picks: (sidecar?.picks ?? []).map((p) => ({
      id: p.id, f2Ppm: p.f2Ppm, label: [...p.label],
      ...(p.f1Ppm !== undefined && { f1Ppm: p.f1Ppm }),
      ...(p.kind !== undefined && { kind: p.kind }),
      ...(p.fromPpm !== undefined && p.toPpm !== undefined && { fromPpm: p.fromPpm, toPpm: p.toPpm }),
      ...(p.protons !== undefined && { protons: p.protons }),
    })),
    couplings: (sidecar?.couplings ?? []).map((c) => ({
      atoms: [c.atoms[0], c.atoms[1]], jHz: c.jHz, jSdHz: c.jSdHz, method: c.method, dimension: c.dimension,
      picks: [...c.picks], flags: [...c.flags],
    })),
    blocked,
  };
  return { view, diagnostics, sidecar, missing: false };
}
