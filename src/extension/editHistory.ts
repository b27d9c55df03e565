/**
 * Undo and redo of the panel's actions for VS Code's custom-editor edit stack. Each action is
 * recorded as the sidecar text before and after; undo writes the text before back, but only while
 * the sidecar still holds the text after: if it moved on (typed in the text editor, a checkout),
 * a blind undo could throw away someone's change, so it is refused with a message instead.
 */

export interface TextTarget {
  text(): string | null;
  write(after: string, label: string): Promise<boolean>;
}

export interface RecordedEdit {
  readonly label: string;
  undo(): Promise<void>;
  redo(): Promise<void>;
}

/**
 * Writes `after` and, when that worked, hands one undoable edit to `record`. A sidecar that did not
 * exist is undone to an empty text, which the panel treats as "no sidecar yet".
 */
export async function writeUndoable(target: TextTarget, after: string, label: string, record: (e: RecordedEdit) => void, notify: (message: string) => void): Promise<boolean> {
  const before = target.text() ?? '';
  if (!(await target.write(after, label))) return false;
  // Read back rather than trust `after`: the editor may have normalised line endings.
  const written = target.text() ?? after;
  const swap = async (from: string, to: string, what: string): Promise<void> => {
    if (target.text() !== from) {
      notify(`Cannot ${what} "${label}": the sidecar has changed since. Use undo in its text editor, or edit it there.`);
      return;
    }
    if (!(await target.write(to, `${what} ${label}`))) notify(`Cannot ${what} "${label}": VS Code did not apply the change.`);
  };
  record({ label, undo: () => swap(written, before, 'undo'), redo: () => swap(before, written, 'redo') });
  return true;
}
