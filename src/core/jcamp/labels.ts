/**
 * Label names compare without spaces, hyphens, slashes and underscores and without regard to case
 * (JCAMP-DX, McDonald & Wilks, Appl. Spectrosc. 42 (1988) 151 [from memory]), so `##DATA TYPE=`,
 * `##DATATYPE=` and `##data_type=` are one label. A leading `.` (spectrometer-specific, defined for
 * NMR by Davies & Lampen, Appl. Spectrosc. 47 (1993) 1093 [from memory]) or `$` (private) is kept.
 */
export function normaliseLabel(raw: string): string {
  return raw.replace(/[\s\-_/]/g, '').toUpperCase();
}

/** Labels whose continuation lines carry data tables, decoded from offsets rather than joined. */
export const DATA_LABELS: ReadonlySet<string> = new Set([
  'XYDATA',
  'DATATABLE',
  'XYPOINTS',
  'PEAKTABLE',
  'PEAKASSIGNMENTS',
]);

/** Text before a `$$` comment, trimmed. */
export function stripComment(s: string): string {
  const at = s.indexOf('$$');
  return (at < 0 ? s : s.slice(0, at)).trim();
}

/** Split a comma-separated NTUPLES list (`##FIRST= 1.5, 2, , 3`) into trimmed fields. */
export function splitList(value: string): string[] {
  return value.split(',').map((f) => f.trim());
}
