/**
 * Completion, hover and diagnostics for atom labels in structure notes (markdown documents whose
 * front matter names `compound:`). Thin glue: the logic is in labelIndex, hoverText,
 * labelCompletion and noteDiagnostics. Diagnostics refresh when a note changes and when any
 * sidecar changes (an accept in the panel, an undo, a checkout).
 */
import * as vscode from 'vscode';
import { labelMatches } from '../../core/notes/labels';
import { readSettings } from '../settings';
import { readFrontMatter } from '../../core/notes/frontMatter';
import { readKarplusRequests } from '../../core/notes/karplusRequests';
import { readStructureRef } from '../../core/structure/structureRef';
import type { KarplusEstimate } from '../../core/report/karplusReport';
import { hoverText } from './hoverText';
import { labelCompletions, labelPrefixStart } from './labelCompletion';
import { noteProblems, type PairProblem } from './noteDiagnostics';
import { buildLabelIndex } from './labelIndex';
import { compoundIndex, compoundNoteLabels, compoundOf, compoundSidecars } from './noteFiles';

const MARKDOWN: vscode.DocumentSelector = { language: 'markdown' };
/** Typing stops for this long before a note's diagnostics are recomputed (they read files). */
const DEBOUNCE_MS = 300;

/** What the compound's SI derivation knows, for hover and diagnostics (siSource.ts). */
export interface NoteAnalysis {
  multiplicity(note: vscode.TextDocument, compound: string, label: string): Promise<string | undefined>;
  /** J values of one pair that disagree (COSY, symmetric partner, 1D), as the report's network finds them. */
  pairProblems(note: vscode.TextDocument, compound: string): Promise<readonly PairProblem[]>;
  /** Dihedral estimates for the pairs the note's front matter requests (`karplus:`), as the report gives them. */
  karplus(note: vscode.TextDocument, compound: string): Promise<readonly KarplusEstimate[]>;
}

function completionProvider(): vscode.CompletionItemProvider {
  return {
    async provideCompletionItems(doc, position) {
      const compound = compoundOf(doc);
      if (compound === null) return undefined;
      const linePrefix = doc.lineAt(position.line).text.slice(0, position.character);
      const start = labelPrefixStart(linePrefix);
      if (start === null) return undefined;
      const [index, noteLabels] = await Promise.all([compoundIndex(doc.uri), compoundNoteLabels(doc, compound)]);
      const range = new vscode.Range(position.line, start, position.line, position.character);
      return labelCompletions(index, noteLabels).map((c) => {
        const item = new vscode.CompletionItem(c.label, vscode.CompletionItemKind.Reference);
        item.detail = c.detail;
        item.sortText = c.sortText;
        item.range = range;
        return item;
      });
    },
  };
}

function hoverProvider(analysis: NoteAnalysis): vscode.HoverProvider {
  return {
    async provideHover(doc, position) {
      const compound = compoundOf(doc);
      if (compound === null) return undefined;
      const line = doc.lineAt(position.line).text;
      const hit = labelMatches(line).find((m) => position.character >= m.offset && position.character <= m.offset + m.label.length);
      if (!hit) return undefined;
      const info = (await compoundIndex(doc.uri)).get(hit.label);
      const range = new vscode.Range(position.line, hit.offset, position.line, hit.offset + hit.label.length);
      if (!info) return new vscode.Hover(`**${hit.label}**: no spectrum of this compound assigns it yet.`, range);
      const jDecimals = readSettings((k) => vscode.workspace.getConfiguration().get(k)).jDecimals;
      const [m, karplus] = await Promise.all([
        analysis.multiplicity(doc, compound, hit.label).catch(() => undefined),
        analysis.karplus(doc, compound).catch(() => []),
      ]);
      return new vscode.Hover(new vscode.MarkdownString(hoverText(info, { jDecimals, karplus, ...(m !== undefined && { multiplicity: m }) })), range);
    },
  };
}

class NoteDiagnostics implements vscode.Disposable {
  private readonly collection = vscode.languages.createDiagnosticCollection('couplet-notes');
  private readonly timers = new Map<string, ReturnType<typeof setTimeout>>();

  constructor(private readonly analysis: NoteAnalysis) {}

  schedule(doc: vscode.TextDocument): void {
    const key = doc.uri.toString();
    clearTimeout(this.timers.get(key));
    this.timers.set(key, setTimeout(() => {
      this.timers.delete(key);
      void this.refresh(doc);
    }, DEBOUNCE_MS));
  }

  async refresh(doc: vscode.TextDocument): Promise<void> {
    if (doc.languageId !== 'markdown' || doc.isClosed) return;
    const text = doc.getText();
    const front = readFrontMatter(text);
    if (front.compound === null && front.problem === null) {
      this.collection.delete(doc.uri);
      return;
    }
    const sidecars = await compoundSidecars(doc.uri);
    const pairs = front.compound === null ? [] : await this.analysis.pairProblems(doc, front.compound).catch(() => []);
    const karplus = readKarplusRequests(text, doc.uri.path.split('/').pop() ?? 'note').problems;
    const problems = noteProblems(text, front, buildLabelIndex(sidecars), pairs, karplus, readStructureRef(text).problems);
    if (doc.isClosed || doc.getText() !== text) return; // a newer refresh is on its way
    this.collection.set(doc.uri, problems.map((p) => {
      const d = new vscode.Diagnostic(new vscode.Range(doc.positionAt(p.offset), doc.positionAt(p.offset + p.length)), p.message,
        p.severity === 'error' ? vscode.DiagnosticSeverity.Error : p.severity === 'warning' ? vscode.DiagnosticSeverity.Warning : vscode.DiagnosticSeverity.Information);
      d.source = 'couplet';
      d.code = p.code;
      return d;
    }));
  }

  refreshAll(): void {
    for (const doc of vscode.workspace.textDocuments) if (doc.languageId === 'markdown') this.schedule(doc);
  }

  forget(doc: vscode.TextDocument): void {
    this.collection.delete(doc.uri);
  }

  dispose(): void {
    for (const t of this.timers.values()) clearTimeout(t);
    this.collection.dispose();
  }
}

export function registerNoteFeatures(analysis: NoteAnalysis): vscode.Disposable[] {
  const diagnostics = new NoteDiagnostics(analysis);
  const sidecars = vscode.workspace.createFileSystemWatcher('**/*.couplet.yaml');
  diagnostics.refreshAll();
  return [
    diagnostics,
    sidecars,
    // `-` triggers after `H`; letters already trigger completion as the chemist types.
    vscode.languages.registerCompletionItemProvider(MARKDOWN, completionProvider(), '-'),
    vscode.languages.registerHoverProvider(MARKDOWN, hoverProvider(analysis)),
    vscode.workspace.onDidOpenTextDocument((d) => diagnostics.schedule(d)),
    vscode.workspace.onDidChangeTextDocument((e) => {
      if (e.document.languageId === 'markdown') diagnostics.schedule(e.document);
      // An edit in an open sidecar (the panel's accept, undo) changes what notes can resolve.
      else if (e.document.uri.path.endsWith('.couplet.yaml')) diagnostics.refreshAll();
    }),
    vscode.workspace.onDidCloseTextDocument((d) => diagnostics.forget(d)),
    sidecars.onDidChange(() => diagnostics.refreshAll()),
    sidecars.onDidCreate(() => diagnostics.refreshAll()),
    sidecars.onDidDelete(() => diagnostics.refreshAll()),
  ];
}
