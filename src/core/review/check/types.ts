/** What `couplet check` (and the editor's diagnostics) report: one problem at one file and line. */
import type { Severity } from '../../sidecar/types';

export type CheckRule = 'schema' | 'data-hash' | 'labels' | 'repeated-j' | 'hidden-flags' | 'stale-si' | 'front-matter';

export interface Problem {
  readonly file: string;
  /** 1-based. */
  readonly line: number;
  /** 1-based. */
  readonly column: number;
  readonly severity: Exclude<Severity, 'info'>;
  readonly rule: CheckRule;
  /** Without the file:line prefix (the formatter adds it). */
  readonly message: string;
}

/** One sidecar as the caller read it: its text and, when the data file could be read, its hash. */
export interface SidecarInput {
  readonly file: string;
  readonly text: string;
  /** SHA-256 (hex) of the data file now; null when the data file is missing or unreadable. */
  readonly dataSha256: string | null;
}

export interface NoteInput {
  readonly file: string;
  readonly text: string;
  /** The molfile its front matter names (`structure:`), as the caller read it (text null: unreadable); absent skips the atom check. */
  readonly molfile?: { readonly file: string; readonly text: string | null };
}

/** A compound folder: its sidecars and its structure notes (markdown or LaTeX). */
export interface CompoundInput {
  readonly sidecars: readonly SidecarInput[];
  readonly notes: readonly NoteInput[];
  /** Atom labels the notes define (the caller scans them); undefined skips the label rule. */
  readonly knownLabels?: ReadonlySet<string>;
}

export const lineAt = (text: string, offset: number): number => text.slice(0, offset).split('\n').length;
