/**
 * A picture of the picks for a pull request or the SI: contours, ppm axes (F2 high on the left,
 * F1 high at the top, as the panel draws them), picks with labels and J values, and optionally
 * the changes against another revision. SVG as text, pure: the caller supplies contour rings
 * already in ppm. Fixed colours on white (a picture leaves the editor, so no theme applies);
 * every change kind differs in shape as well as colour, and negative contours are dashed, so the
 * picture also reads in greyscale print.
 */
import { ticks } from 'd3-array';
import { toFixedDecimal } from '../sidecar/decimal';
import { couplingKeyString } from '../sidecar/order';
import type { Coupling, Pick, Sidecar } from '../sidecar/types';
import type { PickChange, Position, SidecarChanges } from './compare';
import { describeChanges } from './describe';
import { el, esc, px, text } from './svgText';

export interface PictureView {
  /** F2 ppm at the left and right edge (left > right). */
  readonly f2: readonly [number, number];
  /** F1 ppm at the top and bottom edge (top > bottom). */
  readonly f1: readonly [number, number];
}

/** One contour level: signed level and rings as flat [f2, f1, f2, f1, ...] ppm lists. */
export interface ContourSet {
  readonly level: number;
  readonly rings: readonly ArrayLike<number>[];
}

export interface PictureInput {
  readonly title: string;
  readonly width: number;
  readonly height: number;
  readonly view: PictureView;
  readonly contours: readonly ContourSet[];
  readonly sidecar: Sidecar | null;
  /** With `compareWith`, the overlay of changes from that revision to `sidecar`. */
  readonly changes?: SidecarChanges;
  readonly compareWith?: string;
}

export const PICTURE_COLOURS = {
  background: '#ffffff', axis: '#333333', grid: '#e4e4e4', positive: '#2f6db5', negative: '#d9822b',
  pick: '#444444', added: '#2e8b57', removed: '#c0392b', moved: '#00838f', relabelled: '#9a6b00', remeasured: '#a0309a',
} as const;
const C = PICTURE_COLOURS;
const MARGIN = { left: 56, right: 250, top: 34, bottom: 42 } as const;

interface Frame {
  readonly x0: number;
  readonly y0: number;
  readonly w: number;
  readonly h: number;
  x(f2: number): number;
  y(f1: number): number;
}

function frame(input: PictureInput): Frame {
  const w = Math.max(40, input.width - MARGIN.left - MARGIN.right);
  const h = Math.max(40, input.height - MARGIN.top - MARGIN.bottom);
  const [l, r] = input.view.f2;
  const [t, b] = input.view.f1;
  return {
    x0: MARGIN.left, y0: MARGIN.top, w, h,
    x: (f2) => MARGIN.left + ((l - f2) / (l - r)) * w,
    y: (f1) => MARGIN.top + ((t - f1) / (t - b)) * h,
  };
}

function contourPaths(f: Frame, sets: readonly ContourSet[], faded: boolean): string {
  return sets.map((s) => {
    const d = s.rings.map((r) => {
      let p = '';
      for (let i = 0; i + 1 < r.length; i += 2) p += `${i === 0 ? 'M' : 'L'}${px(f.x(r[i] ?? 0))},${px(f.y(r[i + 1] ?? 0))}`;
      return `${p}Z`;
    }).join('');
    return d === '' ? '' : el('path', {
      d, fill: 'none', stroke: s.level > 0 ? C.positive : C.negative, 'stroke-width': 0.6,
      'stroke-dasharray': s.level > 0 ? undefined : '2 1.5', opacity: faded ? 0.55 : undefined,
    });
  }).join('\n');
}

function axes(f: Frame, view: PictureView): string {
  const out: string[] = [];
  const fmt = (v: number, step: number): string => v.toFixed(Math.max(0, -Math.floor(Math.log10(step) + 1e-9)));
  const xs = ticks(Math.min(...view.f2), Math.max(...view.f2), 8);
  const ys = ticks(Math.min(...view.f1), Math.max(...view.f1), 6);
  const sx = Math.abs((xs[1] ?? 1) - (xs[0] ?? 0)) || 1;
  const sy = Math.abs((ys[1] ?? 1) - (ys[0] ?? 0)) || 1;
  for (const v of xs) {
    const x = f.x(v);
    out.push(el('line', { x1: x, x2: x, y1: f.y0, y2: f.y0 + f.h, stroke: C.grid, 'stroke-width': 0.5 }));
    out.push(el('line', { x1: x, x2: x, y1: f.y0 + f.h, y2: f.y0 + f.h + 4, stroke: C.axis }));
    out.push(text(x, f.y0 + f.h + 15, fmt(v, sx), { 'text-anchor': 'middle', fill: C.axis }));
  }
  for (const v of ys) {
    const y = f.y(v);
    out.push(el('line', { x1: f.x0, x2: f.x0 + f.w, y1: y, y2: y, stroke: C.grid, 'stroke-width': 0.5 }));
    out.push(el('line', { x1: f.x0 - 4, x2: f.x0, y1: y, y2: y, stroke: C.axis }));
    out.push(text(f.x0 - 6, y + 3.5, fmt(v, sy), { 'text-anchor': 'end', fill: C.axis }));
  }
  out.push(el('rect', { x: f.x0, y: f.y0, width: f.w, height: f.h, fill: 'none', stroke: C.axis }));
  out.push(text(f.x0 + f.w / 2, f.y0 + f.h + 32, 'F2 (ppm)', { 'text-anchor': 'middle', fill: C.axis }));
  out.push(text(14, f.y0 + f.h / 2, 'F1 (ppm)', { 'text-anchor': 'middle', fill: C.axis, transform: `rotate(-90 14 ${px(f.y0 + f.h / 2)})` }));
  return out.join('\n');
}

const at = (p: Position): [number, number] => [p.f2Ppm, p.f1Ppm ?? p.f2Ppm];
const jText = (c: { jHz: number; jSdHz: number }): string => `${toFixedDecimal(c.jHz, 2)}±${toFixedDecimal(c.jSdHz, 2)}`;

/** Marker shapes: plus (pick), circle (added), cross in a dashed circle (removed), square (old place of a move), diamond (relabelled), triangle (re-measured). */
export function marker(kind: 'pick' | 'added' | 'removed' | 'moved-from' | 'moved' | 'relabelled' | 're-measured', x: number, y: number): string {
  const s = 4.5;
  switch (kind) {
    case 'pick': return el('path', { d: `M${px(x - s)},${px(y)}H${px(x + s)}M${px(x)},${px(y - s)}V${px(y + s)}`, stroke: C.pick, 'stroke-width': 1.4 });
    case 'added': return el('circle', { cx: x, cy: y, r: s + 1, fill: 'none', stroke: C.added, 'stroke-width': 2 });
    case 'removed': return el('circle', { cx: x, cy: y, r: s + 1, fill: 'none', stroke: C.removed, 'stroke-width': 1.4, 'stroke-dasharray': '2 2' })
      + el('path', { d: `M${px(x - s + 1)},${px(y - s + 1)}L${px(x + s - 1)},${px(y + s - 1)}M${px(x - s + 1)},${px(y + s - 1)}L${px(x + s - 1)},${px(y - s + 1)}`, stroke: C.removed, 'stroke-width': 1.4 });
    case 'moved-from': return el('rect', { x: x - s, y: y - s, width: 2 * s, height: 2 * s, fill: 'none', stroke: C.moved, 'stroke-width': 1, 'stroke-dasharray': '2 1.5' });
    case 'moved': return el('rect', { x: x - s, y: y - s, width: 2 * s, height: 2 * s, fill: 'none', stroke: C.moved, 'stroke-width': 2 });
    case 'relabelled': return el('path', { d: `M${px(x)},${px(y - s - 1)}L${px(x + s + 1)},${px(y)}L${px(x)},${px(y + s + 1)}L${px(x - s - 1)},${px(y)}Z`, fill: 'none', stroke: C.relabelled, 'stroke-width': 2 });
    case 're-measured': return el('path', { d: `M${px(x)},${px(y - s - 1)}L${px(x + s + 1)},${px(y + s)}L${px(x - s - 1)},${px(y + s)}Z`, fill: 'none', stroke: C.remeasured, 'stroke-width': 2 });
  }
}

function pickLabel(f: Frame, p: Pick, couplings: readonly Coupling[], extra: string[], colour: string): string {
  const x = f.x(p.f2Ppm) + 7;
  const y = f.y(p.f1Ppm ?? p.f2Ppm) - 5;
  const lines = [p.label.length === 0 ? p.id : p.label.join('/'), ...couplings.map((c) => `J ${jText(c)} Hz`), ...extra];
  return lines.map((l, i) => text(x, y + i * 11, l, { fill: i === 0 ? colour : C.axis, 'font-size': i === 0 ? 10 : 9 })).join('');
}

function picksLayer(f: Frame, input: PictureInput): string {
  const s = input.sidecar;
  const ch = input.changes;
  const byPick = new Map<string, PickChange[]>();
  for (const c of ch?.picks ?? []) byPick.set(c.id, [...(byPick.get(c.id) ?? []), c]);
  const remeasured = new Map((ch?.couplings ?? []).flatMap((c) => (c.kind === 're-measured' ? [[couplingKeyString(c.coupling), c] as const] : [])));
  const out: string[] = [];
  for (const p of s?.picks ?? []) {
    const cited = (s?.couplings ?? []).filter((c) => c.picks.includes(p.id));
    const changes = byPick.get(p.id) ?? [];
    const [x, y] = [f.x(p.f2Ppm), f.y(p.f1Ppm ?? p.f2Ppm)];
    const extra: string[] = [];
    let colour: string = C.pick;
    let shape: Parameters<typeof marker>[0] = 'pick';
    for (const c of changes) {
      if (c.kind === 'added') [shape, colour] = ['added', C.added];
      if (c.kind === 'moved') {
        const [fx, fy] = at(c.from);
        out.push(marker('moved-from', f.x(fx), f.y(fy)));
        out.push(el('line', { x1: f.x(fx), y1: f.y(fy), x2: x, y2: y, stroke: C.moved, 'stroke-width': 1.2, 'marker-end': 'url(#couplet-arrow)' }));
        [shape, colour] = ['moved', C.moved];
      }
      if (c.kind === 'relabelled') {
        extra.push(`was ${c.from.length === 0 ? 'unassigned' : c.from.join('/')}`);
        if (shape === 'pick') [shape, colour] = ['relabelled', C.relabelled];
      }
    }
    const jOld = cited.flatMap((c) => {
      const r = remeasured.get(couplingKeyString(c));
      return r === undefined ? [] : [`was ${jText(r.from)} Hz`];
    });
    if (jOld.length > 0 && shape === 'pick') [shape, colour] = ['re-measured', C.remeasured];
    out.push(marker(shape, x, y));
    out.push(pickLabel(f, p, cited, [...extra, ...jOld], colour));
  }
  for (const c of ch?.picks ?? []) {
    if (c.kind !== 'removed') continue;
    const [x, y] = at(c.pick);
    out.push(marker('removed', f.x(x), f.y(y)));
    out.push(text(f.x(x) + 7, f.y(y) - 5, `${c.pick.label.length === 0 ? c.id : c.pick.label.join('/')} (removed)`, { fill: C.removed, 'font-size': 10 }));
  }
  return out.join('\n');
}

const LEGEND: readonly [Parameters<typeof marker>[0], string][] = [
  ['pick', 'pick'], ['added', 'added'], ['removed', 'removed'], ['moved', 'moved (arrow from old place)'],
  ['relabelled', 'relabelled'], ['re-measured', 're-measured J'],
];

function sidePanel(input: PictureInput): string {
  const x = input.width - MARGIN.right + 16;
  let y = MARGIN.top + 4;
  const out: string[] = [];
  out.push(el('path', { d: `M${px(x)},${px(y)}h16`, stroke: C.positive, 'stroke-width': 1.2 }), text(x + 22, y + 3.5, 'positive level', { fill: C.axis }));
  y += 15;
  out.push(el('path', { d: `M${px(x)},${px(y)}h16`, stroke: C.negative, 'stroke-width': 1.2, 'stroke-dasharray': '2 1.5' }), text(x + 22, y + 3.5, 'negative level', { fill: C.axis }));
  const legend = input.changes === undefined ? LEGEND.slice(0, 1) : LEGEND;
  for (const [k, label] of legend) {
    y += 16;
    out.push(marker(k, x + 8, y), text(x + 22, y + 3.5, label, { fill: C.axis }));
  }
  if (input.changes !== undefined) {
    y += 26;
    const described = describeChanges(input.changes);
    // About 5 px per character at 9 px: wrap to the side panel so no line runs off the picture.
    const lines = described.flatMap((l) => wrap(l, Math.floor((MARGIN.right - 24) / 5)));
    out.push(text(x, y, `changes since ${input.compareWith ?? 'the other revision'}: ${described.length === 0 ? 'none' : described.length}`, { fill: C.axis, 'font-weight': 'bold' }));
    const room = Math.max(0, Math.floor((input.height - y - 12) / 11));
    const shown = lines.length > room ? [...lines.slice(0, Math.max(0, room - 1)), `… and ${lines.length - room + 1} more`] : lines;
    for (const l of shown) {
      y += 11;
      out.push(text(x, y, l, { fill: C.axis, 'font-size': 9 }));
    }
  }
  return out.join('\n');
}

/** Words into lines of at most `max` characters (a longer word stays whole); continuation lines indented. */
export function wrap(line: string, max: number): string[] {
  const out: string[] = [];
  let cur = '';
  for (const w of line.split(' ')) {
    if (cur !== '' && cur.length + 1 + w.length > max) {
      out.push(cur);
      cur = `  ${w}`;
    } else cur = cur === '' ? w : `${cur} ${w}`;
  }
  if (cur !== '') out.push(cur);
  return out;
}

export function renderPicture(input: PictureInput): string {
  if (!(input.width >= 200 && input.height >= 150)) throw new RangeError(`picture size ${input.width} x ${input.height} is below 200 x 150`);
  const f = frame(input);
  const head = `<svg xmlns="http://www.w3.org/2000/svg" width="${input.width}" height="${input.height}" viewBox="0 0 ${input.width} ${input.height}" font-family="DejaVu Sans, Arial, sans-serif" font-size="11">`;
  const defs = '<defs>'
    + el('clipPath', { id: 'couplet-plot' }, el('rect', { x: f.x0, y: f.y0, width: f.w, height: f.h }))
    + el('marker', { id: 'couplet-arrow', viewBox: '0 0 8 8', refX: 7, refY: 4, markerWidth: 6, markerHeight: 6, orient: 'auto' },
      el('path', { d: 'M0,0L8,4L0,8Z', fill: C.moved }))
    + '</defs>';
  return [
    head,
    `<title>${esc(input.title)}</title>`,
    defs,
    el('rect', { x: 0, y: 0, width: input.width, height: input.height, fill: C.background }),
    text(MARGIN.left, 20, input.title, { fill: C.axis, 'font-weight': 'bold' }),
    axes(f, input.view),
    el('g', { 'clip-path': 'url(#couplet-plot)' }, `\n${contourPaths(f, input.contours, input.changes !== undefined)}\n${picksLayer(f, input)}\n`),
    sidePanel(input),
    '</svg>',
    '',
  ].join('\n');
}
