// The other sidecars beside a spectrum (the compound's folder, as `couplet report` reads it): their
// couplings give the COSY J of a 1D multiplet's partners. Open documents win (unsaved picks count).
import * as vscode from 'vscode';
import type { SidecarSource } from './multipletPartners';

const SIDECAR = /\.couplet\.yaml$/;

export async function folderSidecars(dataUri: vscode.Uri, own: string): Promise<SidecarSource[]> {
  const folder = vscode.Uri.joinPath(dataUri, '..');
  let entries: [string, vscode.FileType][] = [];
  try {
    entries = await vscode.workspace.fs.readDirectory(folder);
  } catch {
    return [];
  }
  const names = entries.filter(([n, t]) => t === vscode.FileType.File && SIDECAR.test(n) && n !== own).map(([n]) => n).sort();
  const out: SidecarSource[] = [];
  for (const name of names) {
    const uri = vscode.Uri.joinPath(folder, name);
    const open = vscode.workspace.textDocuments.find((d) => d.uri.toString() === uri.toString());
    try {
      out.push({ fileName: name, text: open ? open.getText() : new TextDecoder('utf-8').decode(await vscode.workspace.fs.readFile(uri)) });
    } catch {
      // A sidecar removed meanwhile has nothing to offer.
    }
  }
  return out;
}
