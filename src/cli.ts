// The `couplet` command: thin over src/core (see src/cli/program.ts).
import { runCli } from './cli/program';

process.exitCode = runCli(process.argv.slice(2), {
  out: (t) => process.stdout.write(t),
  err: (t) => process.stderr.write(t),
});
