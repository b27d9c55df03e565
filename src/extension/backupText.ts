/**
 * Hot exit: the sidecar text a backup puts back into the document when VS Code reopens a spectrum
 * with unsaved changes. A backup of "no sidecar yet" is blank; restoring it over a sidecar that
 * exists now (created or pulled meanwhile) would empty the chemist's record, so a blank backup is
 * never restored. Pure, tested in Node.
 */

/** The text to write into the document, or null when it should be left as it is. */
export function textToRestore(backup: string, current: string | null): string | null {
  if (backup === (current ?? '')) return null;
  if (backup.trim() === '') return null;
  return backup;
}
