/**
 * Typed field access on a parsed YAML mapping that records a diagnostic (with field path and
 * line) for every missing, mistyped or unknown field instead of throwing.
 */
import { isMap, isScalar, isSeq, type LineCounter, type Node, type YAMLMap } from 'yaml';
import type { DiagnosticCode, Severity, SidecarDiagnostic } from './types';

export class DiagnosticSink {
  readonly list: SidecarDiagnostic[] = [];
  constructor(
    readonly file: string,
    private readonly lines: LineCounter,
  ) {}

  at(offset: number, severity: Severity, code: DiagnosticCode, field: string | undefined, problem: string): void {
    const { line, col } = this.lines.linePos(offset);
    const where = field === undefined ? '' : `${field}: `;
    this.list.push({
      file: this.file, line, column: col, severity, code, field,
      message: `${this.file}:${line}: ${where}${problem}`,
    });
  }

  node(node: Node | null | undefined, fallbackOffset: number, severity: Severity, code: DiagnosticCode,
    field: string, problem: string): void {
    this.at(node?.range?.[0] ?? fallbackOffset, severity, code, field, problem);
  }
}

/** Short description of what a node holds, for "expected X, found Y" messages. */
export function describe(node: unknown): string {
  if (isMap(node)) return 'a mapping';
  if (isSeq(node)) return 'a list';
  if (isScalar(node)) {
    const v = node.value;
    if (v === null) return 'nothing (null)';
    if (typeof v === 'string') return `the text ${JSON.stringify(v)}`;
    return `${typeof v} ${String(v)}`;
  }
  return 'nothing';
}

export class MapReader {
  private readonly used = new Set<string>();
  ok = true;

  constructor(
    private readonly map: YAMLMap,
    private readonly path: string,
    readonly sink: DiagnosticSink,
  ) {}

  private start(): number {
    return this.map.range?.[0] ?? 0;
  }

  private field(key: string): string {
    return this.path === '' ? key : `${this.path}.${key}`;
  }

  /** The value node of `key`, or undefined (with a diagnostic when required). */
  node(key: string, required: boolean): Node | undefined {
    this.used.add(key);
    const pair = this.map.items.find((p) => isScalar(p.key) && p.key.value === key);
    if (pair === undefined) {
      if (required) this.fail(undefined, 'missing-field', key, 'is missing');
      return undefined;
    }
    const value = pair.value as Node | null;
    if (value === null || (isScalar(value) && value.value === null)) {
      if (required) this.fail(pair.key as Node, 'missing-field', key, 'has no value');
      return undefined;
    }
    return value;
  }

  fail(node: Node | undefined, code: DiagnosticCode, key: string, problem: string): void {
    this.ok = false;
    this.sink.node(node, this.start(), 'error', code, this.field(key), problem);
  }

  /** A problem that does not stop the item from being read or written. */
  warn(node: Node | undefined, code: DiagnosticCode, key: string, problem: string): void {
    this.sink.node(node, this.start(), 'warning', code, this.field(key), problem);
  }

  string(key: string, required: boolean): string | undefined {
    const n = this.node(key, required);
    if (n === undefined) return undefined;
    if (isScalar(n) && typeof n.value === 'string' && n.value.length > 0) return n.value;
    this.fail(n, 'wrong-type', key, `expected non-empty text, found ${describe(n)}`);
    return undefined;
  }

  number(key: string, required: boolean): number | undefined {
    const n = this.node(key, required);
    if (n === undefined) return undefined;
    if (isScalar(n) && typeof n.value === 'number' && Number.isFinite(n.value)) return n.value;
    this.fail(n, 'wrong-type', key, `expected a number, found ${describe(n)}`);
    return undefined;
  }

  /** One of `allowed`. */
  choice<T extends string>(key: string, allowed: readonly T[], required: boolean): T | undefined {
    const n = this.node(key, required);
    if (n === undefined) return undefined;
    const v = isScalar(n) ? n.value : undefined;
    const hit = allowed.find((a) => a === v);
    if (hit !== undefined) return hit;
    this.fail(n, 'invalid-value', key, `expected one of ${allowed.join(', ')}, found ${describe(n)}`);
    return undefined;
  }

  /** A list of items; a single scalar is accepted as a one-item list when `scalarOk`. */
  list<T>(key: string, required: boolean, item: (n: Node) => T | undefined, what: string,
    scalarOk = false): T[] | undefined {
    const n = this.node(key, required);
    if (n === undefined) return undefined;
    const nodes = isSeq(n) ? (n.items as Node[]) : scalarOk && isScalar(n) ? [n] : undefined;
    if (nodes === undefined) {
      this.fail(n, 'wrong-type', key, `expected a list of ${what}, found ${describe(n)}`);
      return undefined;
    }
    const out: T[] = [];
    nodes.forEach((child, i) => {
      const v = item(child);
      if (v === undefined) {
        this.fail(child, 'wrong-type', `${key}[${i}]`, `expected ${what}, found ${describe(child)}`);
      } else out.push(v);
    });
    return out;
  }

  /** Reports keys that the schema does not know. */
  finish(): void {
    for (const pair of this.map.items) {
      const k = isScalar(pair.key) ? pair.key.value : undefined;
      if (typeof k === 'string' && this.used.has(k)) continue;
      this.fail(pair.key as Node, 'unknown-field', String(k), 'is not a field of schema v1 (a rewrite would drop it)');
    }
  }
}

export const textItem = (n: Node): string | undefined =>
  isScalar(n) && typeof n.value === 'string' && n.value.length > 0 ? n.value : undefined;

export const numberItem = (n: Node): number | undefined =>
  isScalar(n) && typeof n.value === 'number' && Number.isFinite(n.value) ? n.value : undefined;
