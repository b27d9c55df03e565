/**
 * Entry point for `extensionTestsPath` (code-server payload or @vscode/test-electron): runs the steps,
 * writes `{ passed, failed, results }` to the result file and rejects when a step failed, which is how
 * @vscode/test-electron learns the outcome. The file is where COUPLET_E2E_RESULT says, else next to
 * the workspace folder (the driver makes that a temporary folder).
 */
import * as fs from 'node:fs/promises';
import * as path from 'node:path';
import * as vscode from 'vscode';
import { runSteps } from './harness';
import { noteSteps } from './notes';
import { steps } from './suite';

export async function run(): Promise<void> {
  const output = vscode.window.createOutputChannel('Couplet in-host tests');
  const log = (line: string): void => {
    output.appendLine(line);
    console.log(`[in-host] ${line}`);
  };
  const folder = vscode.workspace.workspaceFolders?.[0]?.uri.fsPath;
  const resultFile = process.env.COUPLET_E2E_RESULT || (folder ? path.join(path.dirname(folder), 'inhost-result.json') : '');
  let results;
  try {
    results = await runSteps([...steps(), ...noteSteps()], log);
  } catch (e) {
    results = [{ name: 'suite', ok: false, ms: 0, error: e instanceof Error ? e.stack ?? e.message : String(e) }];
  }
  const failed = results.filter((r) => !r.ok).length;
  const summary = { passed: results.length - failed, failed, results };
  if (resultFile) await fs.writeFile(resultFile, JSON.stringify(summary, null, 2));
  log(`${summary.passed} passed, ${failed} failed`);
  if (failed > 0) throw new Error(`${failed} in-host step(s) failed`);
}
