// Atom labels used in the workspace: structure notes (markdown) and sidecars, for label completion.
import * as vscode from 'vscode';
import { labelsInMarkdown, labelsInSidecar, mergeLabels } from '../core/notes/labels';

const EXCLUDE = '**/{node_modules,.git,dist}/**';
/** Enough for a project's notes; a huge workspace should not stall opening a panel. */
const MAX_FILES = 500;

async function readText(uri: vscode.Uri): Promise<string> {
  // An open document may hold unsaved labels the chemist just typed.
  const open = vscode.workspace.textDocuments.find((d) => d.uri.toString() === uri.toString());
  if (open) return open.getText();
  try {
    return new TextDecoder('utf-8').decode(await vscode.workspace.fs.readFile(uri));
  } catch {
    return '';
  }
}

export async function workspaceLabels(): Promise<string[]> {
  const [notes, sidecars] = await Promise.all([
    vscode.workspace.findFiles('**/*.md', EXCLUDE, MAX_FILES),
    vscode.workspace.findFiles('**/*.couplet.yaml', EXCLUDE, MAX_FILES),
  ]);
  const fromNotes = await Promise.all(notes.map(async (u) => labelsInMarkdown(await readText(u))));
  const fromSidecars = await Promise.all(sidecars.map(async (u) => labelsInSidecar(await readText(u), u.path.split('/').pop() ?? '')));
  return mergeLabels(...fromNotes, ...fromSidecars);
}
