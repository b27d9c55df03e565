/** Lines of items in a sidecar's YAML, so that rules about values can point at the right line. */
import { isMap, isScalar, isSeq, type Document, type LineCounter, type Node } from 'yaml';
import { couplingKeyString } from '../../sidecar/order';
import type { Coupling } from '../../sidecar/types';

export interface Located {
  readonly line: number;
  readonly column: number;
}

export interface SidecarLines {
  /** The item's `id:` line, else the first line of the file. */
  pick(id: string): Located;
  /** The item's first line. */
  coupling(c: Coupling): Located;
  /** A top-level field such as data.file (a dotted path). */
  field(path: readonly string[]): Located;
}

export function sidecarLines(doc: Document | null, lines: LineCounter | null): SidecarLines {
  const at = (node: Node | null | undefined): Located => {
    const offset = node?.range?.[0];
    if (offset === undefined || lines === null) return { line: 1, column: 1 };
    const p = lines.linePos(offset);
    return { line: p.line, column: p.col };
  };
  const items = (key: string): Node[] => {
    const seq = doc?.get(key, true);
    return isSeq(seq) ? (seq.items as Node[]) : [];
  };
  return {
    pick(id) {
      const item = items('picks').find((n) => isMap(n) && n.get('id') === id);
      return at(isMap(item) ? (item.get('id', true) as Node | undefined) ?? item : undefined);
    },
    coupling(c) {
      const key = couplingKeyString(c);
      const item = items('couplings').find((n) => {
        if (!isMap(n)) return false;
        const atoms = n.get('atoms', true);
        const pair = isSeq(atoms) ? atoms.items.map((a) => (isScalar(a) ? String(a.value) : '')) : [];
        return pair.length === 2 && couplingKeyString({ atoms: [pair[0] ?? '', pair[1] ?? ''], method: c.method, dimension: c.dimension }) === key
          && n.get('method') === c.method && n.get('dimension') === c.dimension;
      });
      return at(item);
    },
    field(path) {
      return at(doc?.getIn(path, true) as Node | undefined);
    },
  };
}
