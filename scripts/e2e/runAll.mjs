#!/usr/bin/env node
// `npm run test:e2e`: the in-host suite, then the UI tests, both always run (one failing does not hide
// the other's result); exits 1 when either failed. Each prints its own "N passed, N failed" line.
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { repoRoot } from './paths.mjs';

const codes = ['runInHost.mjs', 'runUi.mjs'].map((f) => spawnSync(process.execPath, [join(repoRoot, 'scripts', 'e2e', f)], { stdio: 'inherit' }).status);
process.exit(codes.every((c) => c === 0) ? 0 : 1);
