/** What the CLI tests share: running the CLI in-process, and snapshot files that write `*-changed` on mismatch. */
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect } from 'vitest';
import { runCli } from '../../src/cli/program';

/** Runs `couplet <argv>` and collects what it prints and its exit code. */
export function run(...argv: string[]): { code: number; out: string; err: string } {
  let out = '';
  let err = '';
  const code = runCli(argv, { out: (t) => (out += t), err: (t) => (err += t) });
  return { code, out, err };
}

export const snapshots = join(__dirname, '__snapshots__');

/**
 * Compares with the stored snapshot `<name>.<ext>`; on mismatch writes `<name>-changed.<ext>` beside
 * it and fails with `what changed` and the hint. Written once locally; in CI a missing snapshot
 * means it was lost, which must fail.
 */
export function expectSnapshot(name: string, ext: string, text: string, what: string, hint = ''): void {
  const file = join(snapshots, `${name}.${ext}`);
  const changed = join(snapshots, `${name}-changed.${ext}`);
  if (!existsSync(file)) {
    if (process.env.CI) expect.fail(`snapshot ${file} is missing`);
    mkdirSync(snapshots, { recursive: true });
    writeFileSync(file, text);
  }
  if (readFileSync(file, 'utf8') !== text) {
    writeFileSync(changed, text);
    expect.fail(`${what} changed: compare ${name}-changed.${ext} with ${name}.${ext}${hint}`);
  }
  rmSync(changed, { force: true });
}
