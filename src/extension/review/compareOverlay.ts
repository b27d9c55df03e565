/**
 * One panel's compare overlay (issue 6 review), kept by the host so that it follows the sidecar:
 * while it is shown, an edit (a pick, an undo, typing in the text editor, a checkout) recomputes
 * the marks after a short pause, once for a burst of edits; and a panel whose webview reloaded
 * (hidden, then shown again) gets the overlay back. The old revision's text is read once, when the
 * chemist asks for the comparison. Pure: the glue passes the text, the post and the timer.
 */
import { compareSidecars } from '../../core/review/compare';
import { parseSidecar, SCHEMA_ID, type Sidecar } from '../../core/sidecar';
import type { CompareMessage } from '../../protocol';
import { compareMarks } from './compareMarks';

/** Runs `f` after `ms`; the function returned cancels it. */
export type Schedule = (f: () => void, ms: number) => () => void;

const timeout: Schedule = (f, ms) => {
  const t = setTimeout(f, ms);
  return () => clearTimeout(t);
};

/** Long enough to gather a burst of edits (undo held down, a checkout), short enough to feel live. */
const REFRESH_MS = 300;

interface Shown {
  readonly name: string;
  readonly before: Sidecar | null;
  readonly found: boolean;
}

export class CompareOverlay {
  private shown: Shown | null = null;
  private last: CompareMessage | null = null;
  private cancelPending: (() => void) | null = null;
  /** The panel closed: posting to its webview would throw. */
  private disposed = false;

  constructor(
    private readonly fileName: string,
    /** The sidecar's text now (unsaved edits included); null when there is no file. */
    private readonly text: () => string | null,
    private readonly post: (m: CompareMessage) => void,
    private readonly schedule: Schedule = timeout,
  ) {}

  get active(): boolean {
    return this.shown !== null;
  }

  /**
   * Overlays the changes since revision `name`, whose sidecar text is `oldText` (null: the file
   * was not there yet). Returns why it cannot, or null when shown.
   */
  show(name: string, oldText: string | null): string | null {
    if (this.disposed) return null;
    const before = oldText === null ? null : parseSidecar(oldText, `${name}:${this.fileName}`).sidecar;
    if (oldText !== null && before === null) return `${this.fileName} at ${name} cannot be read as a sidecar (conflict markers or a syntax error).`;
    const now = this.current(before);
    if (now === null) return `${this.fileName} cannot be read now; fix it before comparing.`;
    this.stopPending();
    this.shown = { name, before, found: oldText !== null };
    this.send(this.marksOf(this.shown, now));
    return null;
  }

  clear(): void {
    this.stopPending();
    this.shown = null;
    this.send({ type: 'compare', against: null, marks: [] });
  }

  /** Call on every change of the sidecar text; the overlay follows after a pause. */
  sidecarChanged(): void {
    if (this.shown === null || this.disposed) return;
    this.stopPending();
    this.cancelPending = this.schedule(() => {
      this.cancelPending = null;
      this.refresh();
    }, REFRESH_MS);
  }

  /** Call after the webview was (re)initialised: it has forgotten the overlay. */
  restored(): void {
    if (this.last !== null && this.shown !== null) this.post(this.last);
  }

  dispose(): void {
    this.disposed = true;
    this.stopPending();
    this.shown = null;
  }

  private refresh(): void {
    const shown = this.shown;
    if (shown === null) return;
    const now = this.current(shown.before);
    if (now !== null) return this.send(this.marksOf(shown, now));
    // Half-typed YAML or conflict markers: keep the last marks, and say they are not current.
    this.send({ type: 'compare', against: `${shown.name} (as last readable; ${this.fileName} cannot be read now)`, marks: this.last?.marks ?? [] });
  }

  /** The sidecar now; an empty one when there is none or it is blank (the first pick undone). */
  private current(before: Sidecar | null): Sidecar | null {
    const t = this.text();
    if (t === null || t.trim() === '') {
      const data = before?.data ?? { file: this.fileName.replace(/\.couplet\.yaml$/, ''), sha256: '' };
      return { schema: SCHEMA_ID, data, picks: [], couplings: [] };
    }
    return parseSidecar(t, this.fileName).sidecar;
  }

  private marksOf(s: Shown, now: Sidecar): CompareMessage {
    return { type: 'compare', against: s.found ? s.name : `${s.name} (file not there yet)`, marks: compareMarks(compareSidecars(s.before, now), s.before, now) };
  }

  private send(m: CompareMessage): void {
    this.last = m;
    if (!this.disposed) this.post(m);
  }

  private stopPending(): void {
    this.cancelPending?.();
    this.cancelPending = null;
  }
}
