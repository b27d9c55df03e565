/** Atom labels typed in the label field: "H-3, H-4a", "H-3 H-4a" or "H-3/H-4a" -> ["H-3", "H-4a"]. */
export function parseLabels(text: string): string[] {
  return text.split(/[\s,;/]+/).map((s) => s.trim()).filter((s) => s.length > 0);
}
