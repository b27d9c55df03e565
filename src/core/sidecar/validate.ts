/** Schema v1 validation of a parsed YAML document (see types.ts and SCHEMA.md). */
import { isMap, isScalar, isSeq, type Document, type Node, type YAMLMap } from 'yaml';
import { naturalCompare } from './decimal';
import { compareCouplings, couplingKeyString, normalizeAtoms } from './order';
import { describe, DiagnosticSink, MapReader, numberItem, textItem } from './reader';
import {
  COUPLING_METHODS, DIMENSIONS, PICK_KINDS, SCHEMA_ID, SCHEMA_PREFIX,
  type Coupling, type DataRef, type Pick, type Sidecar,
} from './types';

const ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._~+-]*$/;
const SHA256_PATTERN = /^[0-9a-f]{64}$/;

export function validateDocument(doc: Document, sink: DiagnosticSink): Sidecar | null {
  const root = doc.contents;
  if (!isMap(root)) {
    sink.at(root?.range?.[0] ?? 0, 'error', 'wrong-type', undefined,
      `expected a mapping with schema, data, picks and couplings, found ${describe(root)}`);
    return null;
  }
  const top = new MapReader(root, '', sink);
  if (!checkSchema(top)) return null;
  const data = readData(top);
  const picks = readList(top, 'picks', readPick, sink) ?? [];
  const couplings = readList(top, 'couplings', readCoupling, sink) ?? [];
  top.finish();
  if (data === undefined) return null;
  checkPickIds(picks, sink);
  checkCouplings(couplings, allPickIds(root.get('picks', true)), sink);
  return {
    schema: SCHEMA_ID,
    data,
    picks: picks.map((p) => p.value),
    couplings: couplings.map((c) => c.value),
  };
}

function checkSchema(top: MapReader): boolean {
  const node = top.node('schema', true);
  if (node === undefined) return false;
  const v = isScalar(node) ? node.value : undefined;
  if (v === SCHEMA_ID) return true;
  const version = typeof v === 'string' && v.startsWith(SCHEMA_PREFIX) ? Number(v.slice(SCHEMA_PREFIX.length)) : NaN;
  if (Number.isInteger(version) && version > 1) {
    top.fail(node, 'future-schema', 'schema',
      `${String(v)} was written by a newer version; this one reads ${SCHEMA_ID} only`);
  } else {
    top.fail(node, 'unknown-schema', 'schema', `expected ${SCHEMA_ID}, found ${describe(node)}`);
  }
  return false;
}

function readData(top: MapReader): DataRef | undefined {
  const node = top.node('data', true);
  if (node === undefined) return undefined;
  if (!isMap(node)) {
    top.fail(node, 'wrong-type', 'data', `expected a mapping with file and sha256, found ${describe(node)}`);
    return undefined;
  }
  const r = new MapReader(node, 'data', top.sink);
  const file = r.string('file', true);
  const sha = r.node('sha256', true);
  let sha256: string | undefined;
  if (sha !== undefined) {
    const v = isScalar(sha) ? String(sha.value) : '';
    if (SHA256_PATTERN.test(v)) sha256 = v;
    else r.fail(sha, 'invalid-value', 'sha256', `expected 64 lowercase hex digits, found ${describe(sha)}`);
  }
  r.finish();
  return file !== undefined && sha256 !== undefined ? { file, sha256 } : undefined;
}

/** An item that passed validation, with the node it came from (for positions). */
export interface Located<T> {
  value: T;
  node: YAMLMap;
  path: string;
}

function readList<T>(top: MapReader, key: 'picks' | 'couplings',
  read: (r: MapReader) => T | undefined, sink: DiagnosticSink): Located<T>[] | undefined {
  const node = top.node(key, true);
  if (node === undefined) return undefined;
  if (!isSeq(node)) {
    top.fail(node, 'wrong-type', key, `expected a list, found ${describe(node)}`);
    return undefined;
  }
  const out: Located<T>[] = [];
  (node.items as Node[]).forEach((item, i) => {
    const path = `${key}[${i}]`;
    if (!isMap(item)) {
      top.fail(item, 'wrong-type', `${key}[${i}]`, `expected a mapping, found ${describe(item)}`);
      return;
    }
    const r = new MapReader(item, path, sink);
    const value = read(r);
    r.finish();
    if (value !== undefined && r.ok) out.push({ value, node: item, path });
    else top.ok = false;
  });
  return out;
}

function readPick(r: MapReader): Pick | undefined {
  const id = r.string('id', true);
  if (id !== undefined && !ID_PATTERN.test(id)) {
    r.fail(r.node('id', true), 'invalid-value', 'id', `"${id}" is not a valid id (letters, digits, . _ ~ + -)`);
  }
  const f2Ppm = r.number('f2_ppm', true);
  const f1Ppm = r.number('f1_ppm', false);
  const label = r.list('label', true, textItem, 'atom labels', true);
  if (label !== undefined && label.length > 2) {
    r.fail(r.node('label', true), 'invalid-value', 'label', `expected at most two atom labels, found ${label.length}`);
  }
  const kind = r.choice('kind', PICK_KINDS, false);
  const region = readRegion(r, f2Ppm, f1Ppm);
  const protons = readProtons(r, f1Ppm);
  const note = r.string('note', false);
  if (id === undefined || f2Ppm === undefined || label === undefined || !r.ok) return undefined;
  return {
    id, f2Ppm, label,
    ...(f1Ppm !== undefined && { f1Ppm }),
    ...region,
    ...(kind !== undefined && { kind }),
    ...(protons !== undefined && { protons }),
    ...(note !== undefined && { note }),
  };
}

/** A 1D multiplet's region: both ends or neither, high ppm first, around the pick (SCHEMA.md). */
function readRegion(r: MapReader, f2Ppm: number | undefined, f1Ppm: number | undefined): { fromPpm?: number; toPpm?: number } {
  const fromPpm = r.number('from_ppm', false);
  const toPpm = r.number('to_ppm', false);
  if (fromPpm === undefined && toPpm === undefined) return {};
  const at = r.node(fromPpm === undefined ? 'to_ppm' : 'from_ppm', false);
  if (fromPpm === undefined || toPpm === undefined) {
    r.fail(at, 'missing-field', fromPpm === undefined ? 'from_ppm' : 'to_ppm', 'a multiplet region needs both from_ppm and to_ppm');
  } else if (f1Ppm !== undefined) {
    r.fail(at, 'invalid-value', 'from_ppm', 'a region belongs to a 1D multiplet; this pick has f1_ppm');
  } else if (!(fromPpm > toPpm)) {
    r.fail(at, 'invalid-value', 'from_ppm', `must be above to_ppm (high to low ppm), found ${fromPpm} and ${toPpm}`);
  } else if (f2Ppm !== undefined && (f2Ppm > fromPpm || f2Ppm < toPpm)) {
    r.warn(at, 'invalid-value', 'from_ppm', `f2_ppm ${f2Ppm} lies outside the region ${fromPpm}..${toPpm} ppm`);
  }
  return fromPpm !== undefined && toPpm !== undefined ? { fromPpm, toPpm } : {};
}

/** The integral reference: a whole number of protons on a 1D multiplet. */
function readProtons(r: MapReader, f1Ppm: number | undefined): number | undefined {
  const protons = r.number('protons', false);
  if (protons === undefined) return undefined;
  const at = r.node('protons', false);
  if (!Number.isInteger(protons) || protons < 1 || protons > 99) {
    r.fail(at, 'invalid-value', 'protons', `expected a whole number of protons from 1 to 99, found ${protons}`);
  } else if (f1Ppm !== undefined) {
    r.fail(at, 'invalid-value', 'protons', 'the integral reference is a 1D multiplet; this pick has f1_ppm');
  }
  return protons;
}

function readCoupling(r: MapReader): Coupling | undefined {
  const atoms = r.list('atoms', true, textItem, 'atom labels');
  if (atoms !== undefined && (atoms.length !== 2 || atoms[0] === atoms[1])) {
    r.fail(r.node('atoms', true), 'invalid-value', 'atoms', `expected two different atom labels, found ${atoms.length === 2 ? 'the same label twice' : String(atoms.length)}`);
  }
  const jHz = r.number('j_hz', true);
  const jSdHz = r.number('j_sd_hz', true);
  if (jSdHz !== undefined && jSdHz < 0) r.fail(r.node('j_sd_hz', true), 'invalid-value', 'j_sd_hz', 'must not be negative');
  const method = r.choice('method', COUPLING_METHODS, true);
  const dimension = r.choice('dimension', DIMENSIONS, true);
  const picks = r.list('picks', true, textItem, 'pick ids');
  const flags = r.list('flags', true, textItem, 'flag names');
  const passiveHz = r.list('passive_hz', false, numberItem, 'numbers (Hz)');
  const linewidthHz = r.number('linewidth_hz', false);
  if (linewidthHz !== undefined && linewidthHz <= 0) r.fail(r.node('linewidth_hz', false), 'invalid-value', 'linewidth_hz', 'must be positive');
  const note = r.string('note', false);
  if (atoms === undefined || jHz === undefined || jSdHz === undefined || method === undefined
    || dimension === undefined || picks === undefined || flags === undefined || !r.ok) return undefined;
  return {
    atoms: normalizeAtoms([atoms[0] ?? '', atoms[1] ?? '']), jHz, jSdHz, method, dimension, picks, flags,
    ...(passiveHz !== undefined && { passiveHz }),
    ...(linewidthHz !== undefined && { linewidthHz }),
    ...(note !== undefined && { note }),
  };
}

function checkPickIds(picks: Located<Pick>[], sink: DiagnosticSink): void {
  const seen = new Map<string, string>();
  let reference: string | undefined;
  picks.forEach((p, i) => {
    if (p.value.protons !== undefined) {
      // Two references could disagree; one per spectrum keeps the proton counts unambiguous.
      if (reference !== undefined) {
        sink.node(p.node.get('protons', true) as Node | undefined, p.node.range?.[0] ?? 0, 'error', 'invalid-value', `${p.path}.protons`,
          `only one pick per sidecar may set the integral reference; ${reference} already does`);
      } else reference = p.path;
    }
    const first = seen.get(p.value.id);
    if (first !== undefined) {
      sink.node(p.node, 0, 'error', 'duplicate-pick-id', `${p.path}.id`, `id "${p.value.id}" is already used by ${first}`);
    } else seen.set(p.value.id, p.path);
    const prev = picks[i - 1];
    if (prev !== undefined && naturalCompare(prev.value.id, p.value.id) > 0) {
      sink.node(p.node, 0, 'info', 'unsorted', p.path, `picks are not sorted by id; a rewrite will sort them`);
    }
  });
}

/** Ids of all picks, valid or not, so that one bad pick does not also flag the couplings citing it. */
function allPickIds(seq: unknown): Set<string> {
  const ids = new Set<string>();
  if (!isSeq(seq)) return ids;
  for (const item of seq.items) {
    const id: unknown = isMap(item) ? item.get('id') : undefined;
    if (typeof id === 'string') ids.add(id);
  }
  return ids;
}

function checkCouplings(couplings: Located<Coupling>[], ids: ReadonlySet<string>, sink: DiagnosticSink): void {
  const seen = new Map<string, string>();
  couplings.forEach((c, i) => {
    const key = couplingKeyString(c.value);
    const first = seen.get(key);
    if (first !== undefined) {
      sink.node(c.node, 0, 'error', 'duplicate-coupling', c.path,
        `${c.value.atoms.join('/')} ${c.value.method} ${c.value.dimension} is already recorded by ${first}`);
    } else seen.set(key, c.path);
    for (const id of c.value.picks) {
      if (!ids.has(id)) {
        sink.node(c.node.get('picks', true) as Node | undefined, c.node.range?.[0] ?? 0, 'warning', 'unknown-pick',
          `${c.path}.picks`, `refers to pick "${id}", which is not in picks`);
      }
    }
    const prev = couplings[i - 1];
    if (prev !== undefined && compareCouplings(prev.value, c.value) > 0) {
      sink.node(c.node, 0, 'info', 'unsorted', c.path, 'couplings are not sorted; a rewrite will sort them');
    }
  });
}
