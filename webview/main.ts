/**
 * Webview entry: handshake (`ready` -> `init`), validation of every incoming message with
 * parseToWebview, routing of replies to their requests, and the toolbar wiring.
 */
import { parseToWebview, type FromWebview, type InitMessage, type ToWebview } from '../src/protocol';
import { commandAction } from './keys';
import { checkContourSettings } from './levels';
import { Panel, type Elements } from './panel';
import { readSavedState, type SavedState } from './savedState';
import { Requests, settleInvalidReply, type Rpc } from './rpc';
import { createToolbar, type Toolbar } from './toolkit';
import { bindInput } from './input';
import { parseLabels } from './labels';
import type { ReviewState } from './review';

interface VsCodeApi {
  postMessage(message: FromWebview): void;
  getState(): unknown;
  setState(state: SavedState): void;
}
declare function acquireVsCodeApi(): VsCodeApi;

const vscode = acquireVsCodeApi();

function byId<T extends HTMLElement>(id: string): T {
  const el = document.getElementById(id);
  if (!el) throw new Error(`panel HTML has no #${id}`);
  return el as T;
}

const el: Elements = {
  canvas: byId<HTMLCanvasElement>('plot'),
  readout: byId('readout'),
  status: byId('status'),
  trace: byId('trace'),
  traceCanvas: byId<HTMLCanvasElement>('traceCanvas'),
  traceText: byId('traceText'),
};
const rpc: Rpc = { post: (m) => vscode.postMessage(m), requests: new Requests() };
const changes = byId<HTMLOListElement>('changes');

/** The compare overlay's list beside the plot: one item per change, the focused one marked. */
function showChanges(r: ReviewState): void {
  changes.hidden = r.against === null || r.marks.length === 0;
  changes.replaceChildren(...r.marks.map((m, i) => {
    const li = document.createElement('li');
    li.textContent = m.text;
    li.dataset.index = String(i);
    if (i === r.current) li.setAttribute('aria-current', 'true');
    return li;
  }));
  changes.querySelector('[aria-current="true"]')?.scrollIntoView({ block: 'nearest' });
}
changes.addEventListener('click', (e) => {
  const i = Number((e.target as HTMLElement).closest('li')?.dataset.index);
  if (panel && Number.isInteger(i)) panel.focusChange(i);
  el.canvas.focus();
});
const toolbar = createToolbar(byId('toolbar'));
let panel: Panel | null = null;

function labelKey(p: Panel, t: Toolbar): void {
  const pick = p.pickFor(p.selected);
  if (pick && !t.label.value) t.label.value = pick.label.join(', ');
  t.label.focus();
  t.label.select();
}

function acceptKey(p: Panel, t: Toolbar): void {
  p.accept(parseLabels(t.label.value));
}

function applyLabel(p: Panel, t: Toolbar): void {
  const labels = parseLabels(t.label.value);
  const pick = p.pickFor(p.selected);
  if (pick) {
    rpc.post({ type: 'label', pickId: pick.id, labels });
    p.status(`Labelled ${pick.id}: ${labels.join(', ')}`);
  } else {
    p.status(labels.length ? `Labels ${labels.join(', ')} will be stored on Accept.` : '');
  }
  el.canvas.focus();
}

function start(init: InitMessage): void {
  const saved = readSavedState(vscode.getState(), init.peaks.length);
  panel?.dispose(); // a second init (e.g. the host restarted) replaces the panel
  const p = new Panel(init, el, rpc, (s) => vscode.setState(s), saved);
  panel = p;
  toolbar.setKnownLabels(init.knownLabels);
  toolbar.label.value = p.labelDraft;
  toolbar.lowest.set(p.contours.lowestLevel);
  toolbar.levels.set(p.contours.levels);
  toolbar.spacing.set(p.contours.spacing);
  toolbar.method.set(p.method);
  toolbar.dimension.set(p.dimension);
  // Contour levels and the cross-peak measurement mean nothing on a 1D trace (its analysis runs on selection).
  const twoD = init.spectrum.dims === 2;
  for (const el of [toolbar.dimension.element, toolbar.method.element, toolbar.measure, toolbar.measureAll, toolbar.lowest.element, toolbar.levels.element, toolbar.spacing.element]) {
    toolbar.setEnabled(el, twoD);
  }
  p.onReview = showChanges;
  showChanges(p.review);
  p.setSidecar(init.sidecar);
  const wrap = byId('plotWrap');
  p.resize({ width: wrap.clientWidth, height: wrap.clientHeight });
  el.canvas.focus();
}

function onMessage(m: ToWebview): void {
  if (m.type === 'init') return start(m);
  const p = panel;
  switch (m.type) {
    case 'tile': case 'measured': case 'analysed':
      if (!rpc.requests.resolve(m.inReplyTo, m)) console.warn(`couplet: reply to unknown request ${m.inReplyTo}`);
      return;
    case 'error':
      if (m.inReplyTo !== undefined && rpc.requests.reject(m.inReplyTo, m.message, m.cancelled === true)) return;
      return void p?.status(m.message);
    case 'sidecar': return void p?.setSidecar(m.sidecar);
    case 'compare': return void p?.setReview(m);
    case 'settings': {
      if (!p) return;
      p.applySettings(m.settings);
      toolbar.lowest.set(p.contours.lowestLevel);
      toolbar.levels.set(p.contours.levels);
      toolbar.spacing.set(p.contours.spacing);
      toolbar.method.set(p.method);
      return;
    }
    case 'progress': return void p?.status(m.done < m.total ? `${m.task}: ${m.done} / ${m.total} (Esc cancels)` : `${m.task}: done`);
    case 'command': {
      if (!p) return;
      const a = commandAction(m.command);
      if (a.kind === 'label') return labelKey(p, toolbar);
      if (a.kind === 'accept') return acceptKey(p, toolbar);
      if (a.kind === 'removePick') return removePick(p);
      return p.act(a);
    }
  }
}

window.addEventListener('message', (e: MessageEvent<unknown>) => {
  const parsed = parseToWebview(e.data);
  if (!parsed.ok) {
    console.warn(`couplet: ignored a message from the host: ${parsed.error}`);
    // A reply settles its request with the reason; anything else (a sidecar update) is said in the status line.
    if (!settleInvalidReply(rpc.requests, e.data, parsed.error)) panel?.status(`Couplet ignored an update it could not read (${parsed.error}); reopen the spectrum if the plot looks stale.`);
    return;
  }
  onMessage(parsed.value);
});

function removePick(p: Panel): void {
  const pick = p.pickFor(p.selected);
  if (!pick) return p.status('The selected peak has no pick to remove.');
  if (p.sidecar.blocked) return p.status(`Sidecar not editable: ${p.sidecar.blocked}`);
  rpc.post({ type: 'removePick', pickId: pick.id });
  p.status(`Removed ${pick.id} (undo brings it back).`);
}

bindInput(el.canvas, el.readout, () => panel, {
  label: () => panel && labelKey(panel, toolbar),
  accept: () => panel && acceptKey(panel, toolbar),
  removePick: () => panel && removePick(panel),
});

const contoursFromToolbar = (): void => {
  if (!panel) return;
  const c = { lowestLevel: toolbar.lowest.value(), levels: toolbar.levels.value(), spacing: toolbar.spacing.value() };
  const bad = checkContourSettings(c);
  if (bad) return panel.status(bad);
  panel.status('');
  panel.setContours(c);
};
for (const f of [toolbar.lowest, toolbar.levels, toolbar.spacing]) f.onChange(contoursFromToolbar);
toolbar.method.onChange((v) => { if (panel) { panel.method = v; panel.persist(); } });
toolbar.dimension.onChange((v) => { if (panel) { panel.dimension = v; panel.persist(); } });
toolbar.onClick(toolbar.reset, () => panel?.act({ kind: 'resetZoom' }));
toolbar.onClick(toolbar.measure, () => panel?.measure());
toolbar.onClick(toolbar.accept, () => panel && acceptKey(panel, toolbar));
toolbar.onClick(toolbar.remove, () => panel && removePick(panel));
toolbar.onClick(toolbar.measureAll, () => panel && rpc.post({ type: 'measureAll', method: panel.method }));
toolbar.label.addEventListener('input', () => {
  if (!panel) return;
  panel.labelDraft = toolbar.label.value;
  panel.persist();
});
toolbar.label.addEventListener('keydown', (e) => {
  if (e.key === 'Enter' && panel) applyLabel(panel, toolbar);
  if (e.key === 'Escape') el.canvas.focus();
});

new ResizeObserver(() => {
  const wrap = byId('plotWrap');
  panel?.resize({ width: wrap.clientWidth, height: wrap.clientHeight });
}).observe(byId('plotWrap'));
// VS Code swaps the body's theme class when the colour theme changes.
new MutationObserver(() => panel?.themeChanged()).observe(document.body, { attributes: true, attributeFilter: ['class'] });

vscode.postMessage({ type: 'ready' });
