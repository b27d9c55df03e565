/** Small helpers for SVG written as text: escaping, fixed decimals, elements. */

/** XML text and attribute escaping (XML 1.0 §2.4: `<` and `&` in text; quotes in attributes). */
export function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** One decimal (a tenth of a pixel), no `-0.0`: the same numbers always give the same text. */
export function px(v: number): string {
  const s = v.toFixed(1);
  return s === '-0.0' ? '0.0' : s;
}

export function el(name: string, attrs: Record<string, string | number | undefined>, body?: string): string {
  const a = Object.entries(attrs)
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => ` ${k}="${esc(typeof v === 'number' ? px(v) : String(v))}"`)
    .join('');
  return body === undefined ? `<${name}${a}/>` : `<${name}${a}>${body}</${name}>`;
}

export function text(x: number, y: number, s: string, attrs: Record<string, string | number | undefined> = {}): string {
  return el('text', { x, y, ...attrs }, esc(s));
}
