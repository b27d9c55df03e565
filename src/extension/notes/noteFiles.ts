/**
 * VS Code side of a structure note: the compound's sidecars (`*.couplet.yaml` in the note's
 * folder) and sibling notes, read from open documents first (unsaved edits count) and from disk
 * otherwise. Thin: everything it reads goes to the pure modules beside it.
 */
import * as vscode from 'vscode';
import { labelsInMarkdown } from '../../core/notes/labels';
import { readFrontMatter } from '../../core/notes/frontMatter';
import { buildLabelIndex, type LabelIndex, type SidecarText } from './labelIndex';

const SIDECAR = /\.couplet\.yaml$/;

async function readText(uri: vscode.Uri): Promise<string | null> {
  const open = vscode.workspace.textDocuments.find((d) => d.uri.toString() === uri.toString());
  if (open) return open.getText();
  try {
    return new TextDecoder('utf-8').decode(await vscode.workspace.fs.readFile(uri));
  } catch {
    return null;
  }
}

async function folderFiles(folder: vscode.Uri, test: RegExp): Promise<vscode.Uri[]> {
  try {
    const entries = await vscode.workspace.fs.readDirectory(folder);
    return entries.filter(([name, type]) => type === vscode.FileType.File && test.test(name)).sort(([a], [b]) => a.localeCompare(b))
      .map(([name]) => vscode.Uri.joinPath(folder, name));
  } catch {
    return [];
  }
}

const folderOf = (uri: vscode.Uri): vscode.Uri => vscode.Uri.joinPath(uri, '..');
const baseName = (uri: vscode.Uri): string => uri.path.split('/').pop() ?? uri.path;

/** The sidecars beside a note, as text. */
export async function compoundSidecars(note: vscode.Uri): Promise<SidecarText[]> {
  const uris = await folderFiles(folderOf(note), SIDECAR);
  const texts = await Promise.all(uris.map(async (u) => ({ fileName: baseName(u), text: await readText(u) })));
  return texts.flatMap((t) => (t.text === null ? [] : [{ fileName: t.fileName, text: t.text }]));
}

export async function compoundIndex(note: vscode.Uri): Promise<LabelIndex> {
  return buildLabelIndex(await compoundSidecars(note));
}

/** Labels used in the notes of the same compound in the note's folder (the note itself included). */
export async function compoundNoteLabels(note: vscode.TextDocument, compound: string): Promise<string[]> {
  const others = (await folderFiles(folderOf(note.uri), /\.md$/i)).filter((u) => u.toString() !== note.uri.toString());
  const texts = await Promise.all(others.map(readText));
  const same = texts.filter((t): t is string => t !== null && readFrontMatter(t).compound === compound);
  return [note.getText(), ...same].flatMap(labelsInMarkdown);
}

/** Whether a document is a compound note (markdown with `compound:` in its front matter). */
export function compoundOf(doc: vscode.TextDocument): string | null {
  return doc.languageId === 'markdown' ? readFrontMatter(doc.getText()).compound : null;
}
