/**
 * `karplus:` in a structure note's front matter: the vicinal pairs the chemist wants dihedral
 * estimates for, with the non-H substituents of each H–C–C–H fragment. Pure text in; every problem
 * names the note, the line and the field (`quellopyranol.md:9: karplus[0].orientation[1]: …`).
 *
 *   karplus:
 *     - pair: [H-3a, H-4]
 *       substituents: [C, C, O]     # element (Huggins Δχ table) or a number (Δχ itself)
 *       orientation: [-1, -1, +1]   # ξ of each substituent (Haasnoot et al. 1980), same order
 */
import { isMap, isScalar, isSeq, LineCounter, parseDocument, type Node, type YAMLMap } from 'yaml';
import { HUGGINS_DELTA_CHI, type Substituent } from '../report/karplus';
import { FRONT_MATTER } from './frontMatter';

export interface KarplusSubstituent extends Substituent {
  /** As written: an element symbol (`O`) or the Δχ number (`0.62`). */
  readonly name: string;
}

export interface KarplusRequest {
  readonly pair: readonly [string, string];
  readonly substituents: readonly KarplusSubstituent[];
  /** 1-based line of the request in the note. */
  readonly line: number;
}

export interface KarplusProblem {
  /** 1-based line in the note. */
  readonly line: number;
  /** Offset and length in the note's text, for an editor range. */
  readonly offset: number;
  readonly length: number;
  /** e.g. `karplus[0].orientation[1]`. */
  readonly field: string;
  readonly message: string;
  /** `<note>:<line>: <field>: <message>`. */
  readonly text: string;
}

export interface KarplusRequests {
  readonly requests: KarplusRequest[];
  readonly problems: KarplusProblem[];
}

/** An H–C–C–H fragment has at most four non-H substituents (two on each carbon). */
const MAX_SUBSTITUENTS = 4;
/** Huggins Δχ of common substituents lies within this range (F about 1.7 [mem]); beyond it is a typo. */
const DELTA_CHI_RANGE = [-1, 2] as const;
const KNOWN = Object.keys(HUGGINS_DELTA_CHI).join(', ');

class Collector {
  readonly problems: KarplusProblem[] = [];
  constructor(private readonly note: string, private readonly base: number, private readonly lines: LineCounter) {}

  add(node: Node | null | undefined, field: string, message: string): void {
    const [start, end] = node?.range ?? [0, 0];
    const line = this.lineOf(start);
    this.problems.push({
      line, offset: this.base + start, length: Math.max(1, end - start), field, message, text: `${this.note}:${line}: ${field}: ${message}`,
    });
  }

  lineOf(pos: number): number {
    // +1: the body starts on the line after the opening `---`.
    return this.lines.linePos(pos).line + 1;
  }
}

const show = (n: Node | null | undefined): string => (isScalar(n) ? JSON.stringify(n.value) : n ? n.toString().trim() : 'nothing');

/** Reads every request; a request with any problem is left out (and its problems reported). */
export function readKarplusRequests(text: string, noteName: string): KarplusRequests {
  const m = FRONT_MATTER.exec(text);
  if (!m) return { requests: [], problems: [] };
  const body = m[1] ?? '';
  const base = m[0].indexOf('\n') + 1;
  const lines = new LineCounter();
  const doc = parseDocument(body, { lineCounter: lines });
  // A YAML syntax error is the front matter's own problem (readFrontMatter reports it).
  if (doc.errors.length > 0 || !isMap(doc.contents)) return { requests: [], problems: [] };
  const c = new Collector(noteName, base, lines);
  const list = doc.contents.get('karplus', true);
  if (list === undefined || (isScalar(list) && list.value === null)) return { requests: [], problems: [] };
  if (!isSeq(list)) {
    c.add(list as Node, 'karplus', `must be a list of requests (- pair: [H-3, H-4] …), got ${show(list as Node)}`);
    return { requests: [], problems: c.problems };
  }
  const requests: KarplusRequest[] = [];
  list.items.forEach((item, i) => {
    const before = c.problems.length;
    const r = readRequest(item as Node, `karplus[${i}]`, c);
    if (r && c.problems.length === before) requests.push(r);
  });
  return { requests, problems: c.problems };
}

function readRequest(node: Node, field: string, c: Collector): KarplusRequest | null {
  if (!isMap(node)) {
    c.add(node, field, `must be a mapping with pair, substituents and orientation, got ${show(node)}`);
    return null;
  }
  for (const it of node.items) {
    const key = isScalar(it.key) ? String(it.key.value) : '';
    if (!['pair', 'substituents', 'orientation'].includes(key)) c.add(it.key as Node, `${field}.${key}`, 'unknown field (expected pair, substituents, orientation)');
  }
  const pair = readPair(node, field, c);
  const subs = readSubstituents(node, field, c);
  if (!pair || !subs) return null;
  return { pair, substituents: subs, line: c.lineOf(node.range?.[0] ?? 0) };
}

function readPair(map: YAMLMap, field: string, c: Collector): readonly [string, string] | null {
  const node = map.get('pair', true) as Node | undefined;
  if (node === undefined) {
    c.add(map, `${field}.pair`, 'missing: the two protons, e.g. pair: [H-3a, H-4]');
    return null;
  }
  const labels = isSeq(node) ? node.items.map((x) => (isScalar(x) && typeof x.value === 'string' ? x.value.trim() : '')) : [];
  const [a, b] = labels;
  if (labels.length !== 2 || !a || !b) {
    c.add(node, `${field}.pair`, `must be two atom labels, e.g. [H-3a, H-4], got ${show(node)}`);
    return null;
  }
  if (a === b) {
    c.add(node, `${field}.pair`, `names ${a} twice; a vicinal pair is two different protons`);
    return null;
  }
  return [a, b];
}

function readSubstituents(map: YAMLMap, field: string, c: Collector): KarplusSubstituent[] | null {
  const subsNode = map.get('substituents', true) as Node | undefined;
  const orientNode = map.get('orientation', true) as Node | undefined;
  const subs = subsNode === undefined ? [] : listOf(subsNode, `${field}.substituents`, c);
  const orient = orientNode === undefined ? [] : listOf(orientNode, `${field}.orientation`, c);
  if (!subs || !orient) return null;
  if (subs.length > MAX_SUBSTITUENTS) {
    c.add(subsNode, `${field}.substituents`, `an H–C–C–H fragment has at most ${MAX_SUBSTITUENTS} non-H substituents, got ${subs.length}`);
    return null;
  }
  if (subs.length !== orient.length) {
    c.add(orientNode ?? subsNode ?? map, `${field}.orientation`, `needs one ξ (+1 or -1) per substituent: ${subs.length} substituent(s), ${orient.length} orientation(s)`);
    return null;
  }
  const out: KarplusSubstituent[] = [];
  subs.forEach((s, i) => {
    const deltaChi = deltaChiOf(s, `${field}.substituents[${i}]`, c);
    const o = orient[i];
    const xi = isScalar(o) && (o.value === 1 || o.value === -1) ? o.value : null;
    if (xi === null) c.add(o, `${field}.orientation[${i}]`, `must be +1 or -1, got ${show(o)}`);
    if (deltaChi !== null && xi !== null) out.push({ name: isScalar(s) ? String(s.value) : '', deltaChi, xi });
  });
  return out.length === subs.length ? out : null;
}

function listOf(node: Node, field: string, c: Collector): Node[] | null {
  if (isSeq(node)) return node.items as Node[];
  if (isScalar(node) && node.value === null) return [];
  c.add(node, field, `must be a list, e.g. [C, O], got ${show(node)}`);
  return null;
}

function deltaChiOf(node: Node, field: string, c: Collector): number | null {
  const v = isScalar(node) ? node.value : undefined;
  if (typeof v === 'number') {
    if (Number.isFinite(v) && v >= DELTA_CHI_RANGE[0] && v <= DELTA_CHI_RANGE[1]) return v;
    c.add(node, field, `a Δχ number must lie between ${DELTA_CHI_RANGE[0]} and ${DELTA_CHI_RANGE[1]}, got ${show(node)}`);
    return null;
  }
  const known = typeof v === 'string' && Object.hasOwn(HUGGINS_DELTA_CHI, v.trim()) ? HUGGINS_DELTA_CHI[v.trim()] : undefined;
  if (known !== undefined) return known;
  c.add(node, field, `unknown substituent ${show(node)}: use one of ${KNOWN} or a Huggins Δχ number`);
  return null;
}
