/**
 * A minimal test runner for the extension host (no test framework in the bundle): named steps run in
 * order, each with a timeout; the result goes to a JSON file that the driver outside the host reads,
 * because code-server's extension host has no console the driver can see.
 */
export interface StepResult {
  readonly name: string;
  readonly ok: boolean;
  readonly ms: number;
  readonly error?: string;
}

export interface Step {
  readonly name: string;
  readonly run: () => Promise<void>;
  readonly timeoutMs?: number;
}

export class AssertionError extends Error {}

export function assert(condition: unknown, message: string): asserts condition {
  if (!condition) throw new AssertionError(message);
}

export function assertEqual<T>(actual: T, expected: T, what: string): void {
  if (actual !== expected) throw new AssertionError(`${what}: expected ${JSON.stringify(expected)}, got ${JSON.stringify(actual)}`);
}

export const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));

/** Polls until `probe` returns a value other than undefined; the message says what never happened. */
export async function waitFor<T>(what: string, probe: () => T | undefined | Promise<T | undefined>, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let last: unknown;
  for (;;) {
    try {
      const v = await probe();
      if (v !== undefined) return v;
    } catch (e) {
      last = e;
    }
    if (Date.now() > deadline) throw new AssertionError(`timed out after ${timeoutMs / 1000} s waiting for ${what}${last ? ` (last error: ${String(last)})` : ''}`);
    await sleep(100);
  }
}

function withTimeout(p: Promise<void>, ms: number, name: string): Promise<void> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const t = new Promise<void>((_, reject) => {
    timer = setTimeout(() => reject(new AssertionError(`step "${name}" took longer than ${ms / 1000} s`)), ms);
  });
  return Promise.race([p, t]).finally(() => clearTimeout(timer));
}

/** Runs the steps in order; a failed step does not stop the later ones (each sets up what it needs). */
export async function runSteps(steps: readonly Step[], log: (line: string) => void): Promise<StepResult[]> {
  const results: StepResult[] = [];
  for (const s of steps) {
    const start = Date.now();
    try {
      await withTimeout(s.run(), s.timeoutMs ?? 60_000, s.name);
      results.push({ name: s.name, ok: true, ms: Date.now() - start });
      log(`ok   ${s.name}`);
    } catch (e) {
      const error = e instanceof Error ? (e instanceof AssertionError ? e.message : e.stack ?? e.message) : String(e);
      results.push({ name: s.name, ok: false, ms: Date.now() - start, error });
      log(`FAIL ${s.name}: ${error}`);
    }
  }
  return results;
}
