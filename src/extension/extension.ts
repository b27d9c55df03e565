/** Entry point: the spectrum editor, its commands, the sidecar diagnostics and the worker. */
import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import * as vscode from 'vscode';
import { keepNotesInView } from './besideNote';
import { registerCommands } from './commands';
import { FitClient, type WorkerLike } from './fitClient';
import { registerInsertSi } from './notes/insertSiCommand';
import { compoundOf } from './notes/noteFiles';
import { registerNoteFeatures } from './notes/notesFeatures';
import { registerCheckDiagnostics } from './review/checkDiagnostics';
import { SiSource } from './notes/siSource';
import { SpectrumEditorProvider, VIEW_TYPE } from './spectrumEditor';

export function activate(context: vscode.ExtensionContext): void {
  const output = vscode.window.createOutputChannel('Couplet');
  const diagnostics = vscode.languages.createDiagnosticCollection('couplet');
  const workerFile = path.join(context.extensionPath, 'dist', 'fitWorker.js');
  const spawn = (): WorkerLike => new Worker(workerFile);
  const provider = new SpectrumEditorProvider(context.extensionUri, diagnostics, output, spawn);
  context.subscriptions.push(
    output,
    diagnostics,
    // No retainContextWhenHidden: the webview keeps its view state with getState/setState.
    vscode.window.registerCustomEditorProvider(VIEW_TYPE, provider, { supportsMultipleEditorsPerDocument: true }),
    ...registerCommands(provider, output),
    keepNotesInView(VIEW_TYPE),
  );
  // Structure notes: label completion, hover, diagnostics, and the SI line command.
  // The compound reports behind hover, note diagnostics and the insert command run in a worker of their own.
  const reports = new FitClient(spawn, null);
  const si = new SiSource((input) => reports.compound(input));
  context.subscriptions.push(
    { dispose: () => reports.dispose() },
    ...registerNoteFeatures(si),
    registerInsertSi((doc, compound, lang) => si.siLine(doc, compound, lang), compoundOf, output),
    // `couplet check` problems (labels, repeated J, flagged J in the SI) on sidecars and notes.
    ...registerCheckDiagnostics(),
  );
}

export function deactivate(): void {
  // Workers and watchers are disposed with their documents.
}
