/**
 * What a compound's sidecars say about each atom label: where the label was picked (shift, kind,
 * file, pick id) and the couplings it takes part in (J, sigma, method, flags, file, picks). Pure:
 * the glue reads the `*.couplet.yaml` files in the note's folder and passes their text in.
 */
import { naturalCompare, parseSidecar, type CouplingMethod, type Dimension, type PickKind } from '../../core/sidecar';

export interface SidecarText {
  /** File name as shown to the user, e.g. `cosy.jdx.couplet.yaml`. */
  readonly fileName: string;
  readonly text: string;
}

/** One place a label was picked: a cross peak gives its F2 atom the F2 shift and its F1 atom the F1 shift. */
export interface LabelShift {
  readonly ppm: number;
  readonly axis: 'F2' | 'F1';
  readonly kind: PickKind | undefined;
  readonly fileName: string;
  readonly pickId: string;
  /** The data file the sidecar describes (`cosy.jdx`): 1D multiplet picks come from a 1D spectrum. */
  readonly dataFile: string;
}

export interface LabelCoupling {
  readonly partner: string;
  readonly jHz: number;
  readonly jSdHz: number;
  readonly method: CouplingMethod;
  readonly dimension: Dimension;
  readonly flags: readonly string[];
  readonly picks: readonly string[];
  readonly fileName: string;
}

export interface LabelInfo {
  readonly label: string;
  readonly shifts: readonly LabelShift[];
  readonly couplings: readonly LabelCoupling[];
}

export interface LabelIndex {
  /** Labels any readable sidecar assigns, in natural order. */
  readonly labels: readonly string[];
  get(label: string): LabelInfo | undefined;
  /** Sidecars read (readable or not): with none, nothing has been measured yet. */
  readonly sidecarCount: number;
  /** Whether a readable sidecar of a 1D spectrum exists (it should then name every proton). */
  readonly has1D: boolean;
  /** `<file>: <first error>` for sidecars that could not be read; their labels are missing. */
  readonly unreadable: readonly string[];
}

interface MutableInfo { label: string; shifts: LabelShift[]; couplings: LabelCoupling[] }

export function buildLabelIndex(files: readonly SidecarText[]): LabelIndex {
  const byLabel = new Map<string, MutableInfo>();
  const info = (label: string): MutableInfo => {
    let i = byLabel.get(label);
    if (!i) byLabel.set(label, (i = { label, shifts: [], couplings: [] }));
    return i;
  };
  const unreadable: string[] = [];
  let has1D = false;
  for (const f of files) {
    const { sidecar, diagnostics } = parseSidecar(f.text, f.fileName);
    if (sidecar === null) {
      const first = diagnostics.find((d) => d.severity === 'error');
      unreadable.push(first?.message ?? `${f.fileName}: cannot be read as a sidecar`);
      continue;
    }
    const dataFile = sidecar.data.file;
    for (const p of sidecar.picks) {
      if (p.f1Ppm === undefined) has1D = true;
      const [a, b] = p.label;
      const base = { kind: p.kind, fileName: f.fileName, pickId: p.id, dataFile };
      if (a !== undefined && a.trim() !== '') info(a).shifts.push({ ...base, ppm: p.f2Ppm, axis: 'F2' });
      // A diagonal pick carries one label; its F1 shift repeats F2 and adds nothing.
      if (b !== undefined && b.trim() !== '' && p.f1Ppm !== undefined) info(b).shifts.push({ ...base, ppm: p.f1Ppm, axis: 'F1' });
    }
    for (const c of sidecar.couplings) {
      const common = { jHz: c.jHz, jSdHz: c.jSdHz, method: c.method, dimension: c.dimension, flags: c.flags, picks: c.picks, fileName: f.fileName };
      info(c.atoms[0]).couplings.push({ ...common, partner: c.atoms[1] });
      info(c.atoms[1]).couplings.push({ ...common, partner: c.atoms[0] });
    }
  }
  const labels = [...byLabel.keys()].sort(naturalCompare);
  return { labels, get: (l) => byLabel.get(l), sidecarCount: files.length, has1D, unreadable };
}

/** The label's shift: the mean of its picks (1D multiplet picks preferred: they are the 1D centre). */
export function shiftOf(info: LabelInfo): { ppm: number; from: readonly LabelShift[] } | null {
  const oneD = info.shifts.filter((s) => s.kind === 'multiplet');
  const used = oneD.length > 0 ? oneD : info.shifts;
  if (used.length === 0) return null;
  return { ppm: used.reduce((sum, s) => sum + s.ppm, 0) / used.length, from: used };
}
