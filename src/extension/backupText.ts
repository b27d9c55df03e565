/**
 * Hot exit: the backup of the unsaved sidecar text, and what of it is put back into the document
 * when VS Code reopens a spectrum. `workspace.fs.writeFile` is not atomic: a backup cut short (the
 * window killed mid-write) could end at a line break and still read as a valid sidecar with its last
 * picks missing. So the backup starts with a check line (length and SHA-256 of the text) and a
 * backup that does not match it is not restored. A backup of "no sidecar yet" is blank; restoring
 * it over a sidecar that exists now (created or pulled meanwhile) would empty the chemist's record,
 * so a blank backup is never restored. No vscode import: tested in Node.
 */
import { createHash } from 'node:crypto';

const HEAD = 'couplet-backup';

const digest = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');

/** The backup file's content for the document text. */
export function encodeBackup(text: string): string {
  return `${HEAD} ${Buffer.byteLength(text, 'utf8')} ${digest(text)}\n${text}`;
}

/** The document text of a backup, or null when it is damaged (cut short, altered). */
export function decodeBackup(raw: string): string | null {
  if (!raw.startsWith(`${HEAD} `)) return raw; // written before the check line existed
  const eol = raw.indexOf('\n');
  const [, bytes, sha] = (eol < 0 ? raw : raw.slice(0, eol)).split(' ');
  const text = eol < 0 ? '' : raw.slice(eol + 1);
  return eol >= 0 && Number(bytes) === Buffer.byteLength(text, 'utf8') && sha === digest(text) ? text : null;
}

/** The text to write into the document, or null when it should be left as it is. */
export function textToRestore(backup: string, current: string | null): string | null {
  if (backup === (current ?? '')) return null;
  if (backup.trim() === '') return null;
  return backup;
}
