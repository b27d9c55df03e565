/**
 * The ONLY module that knows about @vscode/webview-ui-toolkit (no longer maintained): it builds
 * the toolbar and hands back plain DOM elements and small typed accessors. Replacing the toolkit
 * means rewriting this file alone.
 */
import { provideVSCodeDesignSystem, vsCodeButton, vsCodeDropdown, vsCodeOption, vsCodeTextField } from '@vscode/webview-ui-toolkit';

provideVSCodeDesignSystem().register(vsCodeButton(), vsCodeDropdown(), vsCodeOption(), vsCodeTextField());

export interface NumberField {
  readonly element: HTMLElement;
  value(): number;
  set(v: number): void;
  onChange(cb: (v: number) => void): void;
}

export interface Choice<T extends string> {
  readonly element: HTMLElement;
  value(): T;
  set(v: T): void;
  onChange(cb: (v: T) => void): void;
}

export interface Toolbar {
  readonly reset: HTMLElement;
  readonly measure: HTMLElement;
  readonly accept: HTMLElement;
  readonly measureAll: HTMLElement;
  readonly remove: HTMLElement;
  readonly lowest: NumberField;
  readonly levels: NumberField;
  readonly spacing: NumberField;
  readonly method: Choice<'fit' | 'naive'>;
  readonly dimension: Choice<'F2' | 'F1'>;
  /** Plain input with a datalist: native completion of atom labels. */
  readonly label: HTMLInputElement;
  setKnownLabels(labels: readonly string[]): void;
  onClick(el: HTMLElement, cb: () => void): void;
  setEnabled(el: HTMLElement, enabled: boolean): void;
}

/** Value of a toolkit control; the custom elements expose `value` as a property. */
function valueOf(el: HTMLElement): string {
  return String((el as unknown as { value?: unknown }).value ?? '');
}

function setValue(el: HTMLElement, v: string): void {
  (el as unknown as { value: string }).value = v;
}

function button(text: string, title: string, appearance: 'primary' | 'secondary' = 'secondary'): HTMLElement {
  const b = document.createElement('vscode-button');
  b.textContent = text;
  b.title = title;
  b.setAttribute('aria-label', title);
  b.setAttribute('appearance', appearance);
  return b;
}

function numberField(label: string, title: string, size: number): NumberField {
  const el = document.createElement('vscode-text-field');
  el.setAttribute('size', String(size));
  el.setAttribute('aria-label', title);
  el.title = title;
  el.textContent = label;
  return {
    element: el,
    value: () => Number(valueOf(el)),
    set: (v) => setValue(el, String(v)),
    onChange: (cb) => el.addEventListener('change', () => cb(Number(valueOf(el)))),
  };
}

function choice<T extends string>(title: string, options: readonly (readonly [T, string])[]): Choice<T> {
  const el = document.createElement('vscode-dropdown');
  el.setAttribute('aria-label', title);
  el.title = title;
  for (const [value, text] of options) {
    const o = document.createElement('vscode-option');
    o.setAttribute('value', value);
    o.textContent = text;
    el.appendChild(o);
  }
  const first = options[0]?.[0];
  const read = (): T => (options.find(([v]) => v === valueOf(el))?.[0] ?? first) as T;
  return {
    element: el,
    value: read,
    set: (v) => setValue(el, v),
    onChange: (cb) => el.addEventListener('change', () => cb(read())),
  };
}

export function createToolbar(container: HTMLElement): Toolbar {
  const reset = button('Full view', 'Reset zoom to the whole spectrum (0)');
  const measure = button('Measure', 'Measure J at the selected peak (M)', 'primary');
  const accept = button('Accept', 'Store the shown J in the sidecar (A)', 'primary');
  const measureAll = button('Measure all', 'Measure every cross peak');
  const remove = button('Remove pick', 'Remove the pick on the selected peak (Delete)');
  const lowest = numberField('Lowest (x noise)', 'Lowest contour level in multiples of the noise', 5);
  const levels = numberField('Levels', 'Number of contour levels on each sign', 3);
  const spacing = numberField('Spacing', 'Ratio between successive contour levels', 4);
  const method = choice<'fit' | 'naive'>('Measurement method', [['fit', 'Model fit'], ['naive', 'Peak separation']]);
  const dimension = choice<'F2' | 'F1'>('Dimension to measure in', [['F2', 'F2 (direct)'], ['F1', 'F1 (indirect)']]);
  const label = document.createElement('input');
  label.type = 'text';
  label.className = 'label-input';
  label.placeholder = 'H-3, H-4a';
  label.setAttribute('aria-label', 'Atom labels of the selected peak (F2 atom, F1 atom), Enter to apply (L)');
  label.title = 'Atom labels (F2, F1); Enter applies';
  const list = document.createElement('datalist');
  list.id = 'coupletKnownLabels';
  label.setAttribute('list', list.id);
  const group = (...els: HTMLElement[]): HTMLElement => {
    const g = document.createElement('div');
    g.className = 'group';
    g.append(...els);
    return g;
  };
  container.append(
    group(reset),
    group(lowest.element, levels.element, spacing.element),
    group(method.element, dimension.element, measure, accept, measureAll),
    group(label, list, remove),
  );
  return {
    reset, measure, accept, measureAll, remove, lowest, levels, spacing, method, dimension, label,
    setKnownLabels(labels) {
      list.replaceChildren(...labels.map((l) => {
        const o = document.createElement('option');
        o.value = l;
        return o;
      }));
    },
    onClick(el, cb) {
      el.addEventListener('click', cb);
    },
    setEnabled(el, enabled) {
      if (enabled) el.removeAttribute('disabled');
      else el.setAttribute('disabled', '');
    },
  };
}
