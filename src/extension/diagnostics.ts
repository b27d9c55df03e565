/** The sidecar's problems in the Problems panel, at their line and column. */
import * as vscode from 'vscode';
import type { SidecarDiagnostic } from '../core/sidecar';

const SEVERITY: Record<SidecarDiagnostic['severity'], vscode.DiagnosticSeverity> = {
  error: vscode.DiagnosticSeverity.Error,
  warning: vscode.DiagnosticSeverity.Warning,
  info: vscode.DiagnosticSeverity.Information,
};

export function toDiagnostic(d: SidecarDiagnostic): vscode.Diagnostic {
  // Core positions are 1-based; VS Code's are 0-based. The range runs to the end of the line.
  const line = Math.max(0, d.line - 1);
  const col = Math.max(0, d.column - 1);
  const out = new vscode.Diagnostic(new vscode.Range(line, col, line, Number.MAX_SAFE_INTEGER), d.message, SEVERITY[d.severity]);
  out.source = 'couplet';
  out.code = d.code;
  return out;
}

export function publish(collection: vscode.DiagnosticCollection, uri: vscode.Uri, list: readonly SidecarDiagnostic[]): void {
  collection.set(uri, list.map(toDiagnostic));
}
