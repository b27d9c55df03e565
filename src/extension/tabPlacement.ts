/** Whether a spectrum tab that just opened should move beside the structure note (see besideNote.ts). Pure. */

/** What matters about a tab for this decision. */
export interface TabFacts {
  readonly kind: 'note' | 'spectrum' | 'other';
  readonly uri: string;
  /** The tab group's column (1-based), as VS Code numbers them. */
  readonly column: number | undefined;
}

/**
 * Pure decision: `previous` is the active tab before the change, `opened` the tab just opened and
 * now active, `noteStillOpen` whether the previous note is still a tab in that group (a preview
 * tab is replaced by the next preview, and then there is nothing to keep in view).
 */
export function shouldMoveBeside(previous: TabFacts | null, opened: TabFacts, noteStillOpen: boolean): boolean {
  return opened.kind === 'spectrum' && previous !== null && previous.kind === 'note'
    && previous.column !== undefined && previous.column === opened.column && noteStillOpen;
}
