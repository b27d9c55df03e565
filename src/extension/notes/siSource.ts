/**
 * VS Code side of the SI data: finds the compound's folder (the note's own, or for a LaTeX file the
 * folder of the markdown note whose front matter names the compound), reads its sidecars, its 1D
 * spectrum (the first 1D data file by name, as `couplet report` takes it), the observe frequency
 * and, for the insert command, the data files' hashes; compoundSi.ts does the rest. The parsed 1D
 * spectrum and the last result per folder are cached (hover asks often; a 1D spectrum is 64k points).
 */
import { createHash } from 'node:crypto';
import * as vscode from 'vscode';
import { parseJcamp } from '../../core/jcamp';
import type { CompoundReport } from '../../core/report/compound';
import type { Spectrum1D } from '../../core/spectrum/spectrum';
import { labelsInMarkdown } from '../../core/notes/labels';
import { readKarplusRequests } from '../../core/notes/karplusRequests';
import { karplusEstimates, type KarplusEstimate } from '../../core/report/karplusReport';
import { oneDDisagreements } from '../../core/report/siEntries';
import { make1D } from '../../core/spectrum/spectrum';
import { sharedCopy } from '../sharedData';
import type { CompoundRequest } from '../workerMessages';
import { compoundSi, multiplicities, readSources, siText } from './compoundSi';
import { readFrontMatter } from '../../core/notes/frontMatter';
import type { SiText } from './insertSiCommand';
import { compoundSidecars } from './noteFiles';
import type { PairProblem } from './noteDiagnostics';
import type { NoteLanguage } from './siRegion';

const SPECTRUM = /\.(jdx|dx|jcamp)$/i;
const OBSERVE = /^##\.OBSERVE FREQUENCY=\s*([0-9.eE+-]+)/m;
/** The header of a JCAMP-DX file comes first; this much holds its labels. */
const HEADER_CHARS = 8192;

async function readBytes(uri: vscode.Uri): Promise<Uint8Array | null> {
  try {
    return await vscode.workspace.fs.readFile(uri);
  } catch {
    return null;
  }
}

async function readText(uri: vscode.Uri): Promise<string | null> {
  const open = vscode.workspace.textDocuments.find((d) => d.uri.toString() === uri.toString());
  if (open) return open.getText();
  const bytes = await readBytes(uri);
  return bytes === null ? null : new TextDecoder('utf-8').decode(bytes);
}

interface DataFile { readonly name: string; readonly mtime: number; readonly header: string }

async function dataFiles(folder: vscode.Uri): Promise<DataFile[]> {
  let entries: [string, vscode.FileType][] = [];
  try {
    entries = await vscode.workspace.fs.readDirectory(folder);
  } catch {
    return [];
  }
  const names = entries.filter(([n, t]) => t === vscode.FileType.File && SPECTRUM.test(n)).map(([n]) => n).sort();
  const out: DataFile[] = [];
  for (const name of names) {
    const uri = vscode.Uri.joinPath(folder, name);
    const [stat, text] = await Promise.all([vscode.workspace.fs.stat(uri).then((s) => s.mtime, () => 0), readText(uri)]);
    if (text !== null) out.push({ name, mtime: stat, header: text.slice(0, HEADER_CHARS) });
  }
  return out;
}

/** What computes a compound's report: the worker in the extension (seconds of 1D fits must not block the host). */
export type ComputeReport = (input: CompoundRequest['input']) => Promise<CompoundReport>;

/** In-process, for a host without a worker. */
export const computeHere: ComputeReport = async ({ spectrum1D: t, ...rest }) =>
  compoundSi({ ...rest, ...(t && { spectrum1D: make1D(t.title, t.data, t.axis, t.processing) }) });

export class SiSource {
  private readonly spectra = new Map<string, { mtime: number; spectrum: Spectrum1D | null }>();
  /** The last report per folder, by its inputs; a promise, so hover and diagnostics asking at once share one computation. */
  private readonly results = new Map<string, { key: string; report: Promise<CompoundReport> }>();

  constructor(private readonly compute: ComputeReport = computeHere) {}

  /** The note of a compound: the markdown file itself, or the one found in the workspace by its front matter. */
  async noteFor(doc: vscode.TextDocument, compound: string): Promise<{ uri: vscode.Uri; text: string }> {
    if (doc.languageId === 'markdown') return { uri: doc.uri, text: doc.getText() };
    for (const uri of await vscode.workspace.findFiles('**/*.md', '**/{node_modules,.git,dist}/**', 500)) {
      const text = await readText(uri);
      if (text !== null && readFrontMatter(text).compound === compound) return { uri, text };
    }
    throw new Error(`no markdown note with "compound: ${compound}" in its front matter in this workspace`);
  }

  /** `strict` (the insert command) checks every sidecar against its data file's hash first. */
  async compound(noteUri: vscode.Uri, noteText: string, compound: string, strict: boolean): Promise<CompoundReport> {
    const folder = vscode.Uri.joinPath(noteUri, '..');
    const sidecars = await compoundSidecars(noteUri);
    const files = await dataFiles(folder);
    const front = readFrontMatter(noteText);
    const noteLabels = labelsInMarkdown(noteText.slice(front.end));
    const key = JSON.stringify([sidecars, files.map((f) => [f.name, f.mtime]), front.solvent, noteLabels, compound]);
    const cached = this.results.get(folder.toString());
    let dataHashes: Map<string, string> | undefined;
    if (strict) dataHashes = await this.hashes(folder, sidecars);
    else if (cached?.key === key) return cached.report;
    // The first 1D file by name, as `couplet report` takes it: its header declares XYDATA (2D: NTUPLES).
    const oneD = files.find((f) => /^##(?:DATA CLASS=\s*XYDATA|XYDATA=)/im.test(f.header));
    const oneDUri = oneD && vscode.Uri.joinPath(folder, oneD.name);
    const spectrum1D = oneD && oneDUri ? await this.spectrum(oneDUri, oneD.mtime) : null;
    const m = files[0] ? OBSERVE.exec(files[0].header) : null;
    const report = this.compute({
      compound, sidecars, solvent: front.solvent, noteLabels,
      ...(spectrum1D && oneD && oneDUri && {
        spectrum1D: { title: spectrum1D.title, data: spectrum1D.data, axis: spectrum1D.axis, ...(spectrum1D.processing && { processing: spectrum1D.processing }), key: `${oneDUri.toString()}@${oneD.mtime}` },
        spectrum1DFile: oneD.name,
      }),
      ...(m && { observeMhz: Number(m[1]) }), ...(dataHashes && { dataHashes }),
    });
    const entry = { key, report };
    this.results.set(folder.toString(), entry);
    // A failed report is not kept: the next request tries again.
    report.catch(() => {
      if (this.results.get(folder.toString()) === entry) this.results.delete(folder.toString());
    });
    return report;
  }

  private async hashes(folder: vscode.Uri, sidecars: readonly { fileName: string; text: string }[]): Promise<Map<string, string>> {
    const out = new Map<string, string>();
    for (const s of readSources(sidecars).sources) {
      const bytes = await readBytes(vscode.Uri.joinPath(folder, s.sidecar.data.file));
      // A missing data file gets a hash no file has, so the sidecar's check reports the mismatch.
      out.set(s.file, bytes === null ? '0'.repeat(64) : createHash('sha256').update(bytes).digest('hex'));
    }
    return out;
  }

  private async spectrum(uri: vscode.Uri, mtime: number): Promise<Spectrum1D | null> {
    const known = this.spectra.get(uri.toString());
    if (known?.mtime === mtime) return known.spectrum;
    const text = await readText(uri);
    let spectrum: Spectrum1D | null = null;
    if (text !== null) {
      try {
        const s = parseJcamp(text, uri.path.split('/').pop() ?? uri.path);
        // Shared memory: each request to the worker then shares the points instead of copying them.
        spectrum = s.dims === 1 ? { ...s, data: sharedCopy(s.data) } : null;
      } catch {
        // An unreadable 1D file leaves the line without integrals; opening it in the panel says why.
        spectrum = null;
      }
    }
    this.spectra.set(uri.toString(), { mtime, spectrum });
    return spectrum;
  }

  /** For the insert command. */
  async siLine(doc: vscode.TextDocument, compound: string, lang: NoteLanguage): Promise<SiText> {
    const note = await this.noteFor(doc, compound);
    return siText(await this.compound(note.uri, note.text, compound, true), lang);
  }

  /** For the note's diagnostics: disagreeing J values of one pair (empty when nothing can be derived). */
  async pairProblems(doc: vscode.TextDocument, compound: string): Promise<readonly PairProblem[]> {
    try {
      return (await this.compound(doc.uri, doc.getText(), compound, false)).network.diagnostics;
    } catch {
      return [];
    }
  }

  /** For the hover: the label's multiplicity as the SI line writes it; undefined when it cannot be derived. */
  async multiplicity(doc: vscode.TextDocument, compound: string, label: string): Promise<string | undefined> {
    try {
      return multiplicities(await this.compound(doc.uri, doc.getText(), compound, false)).get(label);
    } catch {
      return undefined;
    }
  }

  /** For the hover: dihedral estimates of the pairs the note requests, from the network the report uses (none when it cannot be built). */
  async karplus(doc: vscode.TextDocument, compound: string): Promise<readonly KarplusEstimate[]> {
    const { requests } = readKarplusRequests(doc.getText(), doc.uri.path);
    if (requests.length === 0) return [];
    try {
      const report = await this.compound(doc.uri, doc.getText(), compound, false);
      return karplusEstimates(requests, report.network, oneDDisagreements(report.derived));
    } catch {
      return [];
    }
  }
}
