/** Plain-text table with a header row and columns padded to their widest cell; numbers right-aligned. */
export function formatTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const numeric = header.map((_, i) => rows.length > 0 && rows.every((r) => /^[-+]?[\d.]+/.test(r[i] ?? '') || (r[i] ?? '') === ''));
  const line = (cells: readonly string[]): string =>
    cells
      .map((c, i) => (numeric[i] ? c.padStart(widths[i] ?? 0) : c.padEnd(widths[i] ?? 0)))
      .join('  ')
      .trimEnd();
  return [line(header), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n') + '\n';
}

/** Fixed decimals for output; keeps -0 from printing as "-0.00". */
export function fixed(value: number, decimals: number): string {
  const s = value.toFixed(decimals);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

export function round(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}
