/** One line of text per change, for the CLI, the legend of a picture and the panel's list. */
import { toFixedDecimal } from '../sidecar/decimal';
import type { CouplingChange, PickChange, Position, SidecarChanges } from './compare';

const at = (p: Position): string => (p.f1Ppm === undefined ? toFixedDecimal(p.f2Ppm, 4) : `${toFixedDecimal(p.f2Ppm, 4)}/${toFixedDecimal(p.f1Ppm, 4)}`);
const labels = (l: readonly string[]): string => (l.length === 0 ? '(unassigned)' : l.join('/'));
const j = (v: { jHz: number; jSdHz: number }): string => `${toFixedDecimal(v.jHz, 2)} ± ${toFixedDecimal(v.jSdHz, 2)} Hz`;

export function describePickChange(c: PickChange): string {
  switch (c.kind) {
    case 'added': return `pick ${c.id} added at ${at(c.pick)} ppm ${labels(c.pick.label)}`;
    case 'removed': return `pick ${c.id} removed (was at ${at(c.pick)} ppm ${labels(c.pick.label)})`;
    case 'moved': return `pick ${c.id} moved ${at(c.from)} -> ${at(c.to)} ppm`;
    case 'relabelled': return `pick ${c.id} relabelled ${labels(c.from)} -> ${labels(c.to)}`;
    case 'annotated': return `pick ${c.id} ${c.fields.join(' and ')} changed`;
  }
}

export function describeCouplingChange(c: CouplingChange): string {
  const name = `J(${c.coupling.atoms.join(',')}) ${c.coupling.method} ${c.coupling.dimension}`;
  switch (c.kind) {
    case 'added': return `${name} added: ${j(c.coupling)}`;
    case 'removed': return `${name} removed (was ${j(c.coupling)})`;
    case 're-measured': return `${name} re-measured: ${j(c.from)} -> ${j(c.to)}`;
    case 'amended': return `${name} ${c.fields.join(', ')} changed`;
  }
}

export function describeChanges(c: SidecarChanges): string[] {
  return [
    ...(c.dataChanged ? ['data file or its hash changed'] : []),
    ...c.picks.map(describePickChange),
    ...c.couplings.map(describeCouplingChange),
  ];
}
