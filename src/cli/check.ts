/**
 * `couplet check DIR|SIDECAR`: validates sidecars for CI. The rules are pure (src/core/review/check);
 * this file finds the files, hashes the data (node crypto) and prints the problems.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { Option, type Command } from 'commander';
import { SOLVENT_MISSING } from '../core/report/compound';
import { checkCompound, type CheckOptions, type CompoundInput, type NoteInput, type Problem } from '../core/review/check';
import { parseSidecar } from '../core/sidecar';
import { labelsInMarkdown } from '../core/notes/labels';
import { readStructureRef } from '../core/structure/structureRef';
import { findCompounds, SIDECAR } from './compounds';
import { EXIT_MEASURE_FAILED, EXIT_OK, InputError } from './errors';
import type { CliIo } from './io';
import { buildReports } from './report';

const NOTE = /\.(md|markdown|tex)$/i;

export { findCompounds };

export type CheckFormat = 'text' | 'json' | 'annotations';

function readText(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (e) {
    throw new InputError(`${path}: cannot read file (${(e as NodeJS.ErrnoException).code ?? String(e)})`);
  }
}

function sha256Of(path: string): string | null {
  try {
    return createHash('sha256').update(readFileSync(path)).digest('hex');
  } catch {
    return null;
  }
}

/** The note with the molfile its front matter names (read here: the rules are pure). */
function withMolfile(folder: string, note: NoteInput): NoteInput {
  const ref = readStructureRef(note.text);
  if (ref.structure === null) return note;
  const file = join(folder, ref.structure);
  let text: string | null;
  try {
    text = readFileSync(file, 'utf8');
  } catch {
    text = null;
  }
  return { ...note, molfile: { file, text } };
}

/** What the pure rules need for one folder: sidecars with their data hash, notes, labels. */
export function readCompound(folder: string, sidecarFiles: readonly string[]): CompoundInput {
  const sidecars = sidecarFiles.map((file) => {
    const text = readText(file);
    const dataName = parseSidecar(text, file).sidecar?.data.file ?? basename(file).slice(0, -SIDECAR.length);
    return { file, text, dataSha256: sha256Of(join(folder, dataName)) };
  });
  const notes: NoteInput[] = readdirSync(folder).sort().filter((n) => NOTE.test(n))
    .map((n) => withMolfile(folder, { file: join(folder, n), text: readText(join(folder, n)) }));
  if (notes.length === 0) return { sidecars, notes };
  return { sidecars, notes, knownLabels: new Set(notes.flatMap((n) => labelsInMarkdown(n.text))) };
}

/**
 * What the SI regions of a folder's notes should hold: the line `couplet report` gives (issue 5's
 * formatter), markdown or LaTeX by the note's extension. Nothing when the report cannot be made
 * (a broken sidecar: its own problems are reported), when sub-folders hold further compounds, or
 * when the note names no solvent (then the editor and the report fill in different placeholders).
 */
function siOptions(folder: string): CheckOptions {
  if (findCompounds(folder).size !== 1) return {};
  let report: ReturnType<typeof buildReports>[number] | undefined;
  try {
    report = buildReports(folder)[0];
  } catch {
    return {};
  }
  if (report === undefined || report.header.solvent === SOLVENT_MISSING) return {};
  const line = report.siLine;
  return { expectedSi: (kind, note) => (kind !== 'H1' ? undefined : /\.tex$/i.test(note) ? line.tex : line.md) };
}

export interface CheckReport {
  readonly problems: readonly Problem[];
  readonly sidecars: number;
  readonly notes: number;
}

export function runChecks(target: string): CheckReport {
  const problems: Problem[] = [];
  let sidecars = 0;
  let notes = 0;
  for (const [folder, files] of findCompounds(target)) {
    const input = readCompound(folder, files);
    sidecars += input.sidecars.length;
    notes += input.notes.length;
    problems.push(...checkCompound(input, siOptions(folder)));
  }
  return { problems, sidecars, notes };
}

export function formatReport(r: CheckReport, format: CheckFormat): string {
  const count = (s: Problem['severity']): number => r.problems.filter((p) => p.severity === s).length;
  if (format === 'json') {
    return JSON.stringify({
      problems: r.problems, checked: { sidecars: r.sidecars, notes: r.notes },
      errors: count('error'), warnings: count('warning'),
    }, null, 2) + '\n';
  }
  if (format === 'annotations') {
    // file:line:column: severity: message — the compiler-message convention CI log parsers turn into inline annotations.
    return r.problems.map((p) => `${p.file}:${p.line}:${p.column}: ${p.severity}: ${p.message}\n`).join('');
  }
  const lines = r.problems.map((p) => `${p.file}:${p.line}: ${p.severity}: ${p.message}\n`).join('');
  return `${lines}checked ${r.sidecars} sidecar(s) and ${r.notes} note(s): ${count('error')} error(s), ${count('warning')} warning(s)\n`;
}

/** Problems make the exit code 1: errors always, warnings with --strict. */
export function checkExitCode(r: CheckReport, strict: boolean): number {
  const failing = r.problems.some((p) => p.severity === 'error' || (strict && p.severity === 'warning'));
  return failing ? EXIT_MEASURE_FAILED : EXIT_OK;
}

export function registerCheck(program: Command, io: CliIo, setCode: (code: number) => void): void {
  program
    .command('check')
    .description('validate sidecars and the SI regions of the notes (for CI); exit 1 on errors, or on warnings with --strict')
    .argument('<target>', 'a sidecar (*.couplet.yaml) or a directory searched for them')
    .addOption(new Option('--format <format>', 'text, json, or annotations (file:line:column: severity: message)').choices(['text', 'json', 'annotations']).default('text'))
    .option('--strict', 'warnings fail too')
    .action((target: string, o: { format: CheckFormat; strict?: boolean }) => {
      const r = runChecks(target);
      io.out(formatReport(r, o.format));
      setCode(checkExitCode(r, o.strict === true));
    });
}
