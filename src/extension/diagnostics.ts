/** The sidecar's problems in the Problems panel, at their line and column. */
import * as vscode from 'vscode';
import type { SidecarDiagnostic } from '../core/sidecar';

const SEVERITY: Record<SidecarDiagnostic['severity'], vscode.DiagnosticSeverity> = {
  error: vscode.DiagnosticSeverity.Error,
  warning: vscode.DiagnosticSeverity.Warning,
  info: vscode.DiagnosticSeverity.Information,
};

/** From the core's 1-based line and column to VS Code's 0-based range, running to the end of the line. */
export function lineRange(line1: number, column1: number): vscode.Range {
  const line = Math.max(0, line1 - 1);
  return new vscode.Range(line, Math.max(0, column1 - 1), line, Number.MAX_SAFE_INTEGER);
}

export function toDiagnostic(d: SidecarDiagnostic): vscode.Diagnostic {
  const out = new vscode.Diagnostic(lineRange(d.line, d.column), d.message, SEVERITY[d.severity]);
  out.source = 'couplet';
  out.code = d.code;
  return out;
}

export function publish(collection: vscode.DiagnosticCollection, uri: vscode.Uri, list: readonly SidecarDiagnostic[]): void {
  collection.set(uri, list.map(toDiagnostic));
}
