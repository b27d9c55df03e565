import { Command, CommanderError, InvalidArgumentError, Option } from 'commander';
import { EXIT_BAD_INPUT, EXIT_MEASURE_FAILED, EXIT_OK, InputError, MeasureFailed } from './errors';
import { registerCheck } from './check';
import { expandInputs, loadSpectrum, type CliIo } from './io';
import { info, infoText } from './info';
import { measureAll, measureAt, measurementsText, notesText, require2D, type MeasureOptions, type MeasurementJson } from './measure';
import { measure1D, multipletsText, type MultipletAnalysisJson } from './measure1D';
import { peaks, peaksText } from './peaks';
import { registerReport } from './report';
import { registerRender } from './render';

function ppmArg(value: string): number {
  const v = Number(value);
  if (!Number.isFinite(v) || value.trim() === '') throw new InvalidArgumentError(`'${value}' is not a number of ppm`);
  return v;
}

function positiveArg(value: string): number {
  const v = Number(value);
  if (!(v > 0)) throw new InvalidArgumentError(`'${value}' is not a positive number`);
  return v;
}

interface MeasureCliOptions {
  f2?: number;
  f1?: number;
  from?: number;
  to?: number;
  all?: boolean;
  json?: boolean;
  method: 'fit' | 'naive';
  dimension: 'F2' | 'F1';
  threshold?: number;
}

function runMeasure(io: CliIo, target: string, o: MeasureCliOptions): number {
  const mo: MeasureOptions = { method: o.method, dimension: o.dimension, threshold: o.threshold };
  if (!o.all) {
    const [file] = expandInputs(target);
    if (!file || file !== target) throw new InputError(`${target}: measure at a point needs a file, not a directory`);
    const s = loadSpectrum(file);
    if (s.dims === 1) {
      if (o.f2 === undefined && o.from === undefined) throw new InputError('measure on a 1D spectrum needs --from PPM --to PPM, --f2 PPM, or --all');
      const ms = measure1D(file, s, { from: o.from, to: o.to, f2: o.f2 }, o.threshold);
      io.out(o.json ? JSON.stringify(ms[0], null, 2) + '\n' : multipletsText(ms));
      return EXIT_OK;
    }
    if (o.f2 === undefined || o.f1 === undefined) throw new InputError('measure needs --f2 PPM and --f1 PPM (or --all)');
    const m = measureAt(file, require2D(file, s), o.f2, o.f1, mo);
    io.out(o.json ? JSON.stringify(m, null, 2) + '\n' : measurementsText([m]) + notesText([m]));
    return EXIT_OK;
  }
  const results: MeasurementJson[] = [];
  const multiplets: MultipletAnalysisJson[] = [];
  const failures: string[] = [];
  for (const file of expandInputs(target)) {
    const s = loadSpectrum(file);
    if (s.dims === 1) {
      multiplets.push(...measure1D(file, s, {}, o.threshold));
      continue;
    }
    const r = measureAll(file, s, mo);
    results.push(...r.results);
    failures.push(...r.failures);
  }
  if (o.json) io.out(JSON.stringify({ measurements: results, multiplets, failures }, null, 2) + '\n');
  else {
    const twoD = results.length > 0 ? measurementsText(results) + notesText(results) : '';
    io.out(twoD + (multiplets.length > 0 ? (twoD ? '\n' : '') + multipletsText(multiplets) : '') + failures.map((f) => `failed: ${f}\n`).join(''));
  }
  return results.length + multiplets.length > 0 ? EXIT_OK : EXIT_MEASURE_FAILED;
}

export function buildProgram(io: CliIo, setCode: (code: number) => void): Command {
  const program = new Command('couplet')
    .description('Coupling constants from DQF-COSY spectra (JCAMP-DX), with honest uncertainties.')
    .version('0.1.0')
    .exitOverride()
    .configureOutput({ writeOut: io.out, writeErr: io.err });

  program
    .command('info')
    .description('dimensions, axes (ppm and Hz) and observe frequency')
    .argument('<file>', 'JCAMP-DX spectrum')
    .option('--json', 'machine-readable output')
    .action((file: string, o: { json?: boolean }) => {
      const i = info(file, loadSpectrum(file));
      io.out(o.json ? JSON.stringify(i, null, 2) + '\n' : infoText(i));
      setCode(EXIT_OK);
    });

  program
    .command('peaks')
    .description('picked peaks grouped into cross and diagonal peaks (2D) or multiplets (1D)')
    .argument('<file>', 'JCAMP-DX spectrum')
    .option('--json', 'machine-readable output')
    .option('--threshold <k>', 'pick above k times the noise sigma', positiveArg)
    .action((file: string, o: { json?: boolean; threshold?: number }) => {
      const p = peaks(file, loadSpectrum(file), o.threshold);
      io.out(o.json ? JSON.stringify(p, null, 2) + '\n' : peaksText(p));
      setCode(EXIT_OK);
    });

  program
    .command('measure')
    .description('J at the cross peak nearest a point, or at every cross peak (--all); on a 1D spectrum, the multiplet analysis of a region')
    .argument('<target>', 'JCAMP-DX DQF-COSY or 1D ¹H spectrum (a directory with --all)')
    .option('--f2 <ppm>', 'F2 (direct) position, ppm; on a 1D spectrum, the multiplet there', ppmArg)
    .option('--f1 <ppm>', 'F1 (indirect) position, ppm', ppmArg)
    .option('--from <ppm>', '1D: one end of the multiplet region, ppm', ppmArg)
    .option('--to <ppm>', '1D: the other end of the multiplet region, ppm', ppmArg)
    .option('--all', 'measure every cross peak of the file, or of every file under a directory')
    .addOption(new Option('--method <method>', 'fit (model fit) or naive (antiphase peak distance, for comparison)').choices(['fit', 'naive']).default('fit'))
    .addOption(new Option('--dimension <dim>', 'dimension to measure in').choices(['F2', 'F1']).default('F2'))
    .option('--threshold <k>', 'pick above k times the noise sigma', positiveArg)
    .option('--json', 'machine-readable output')
    .action((target: string, o: MeasureCliOptions) => setCode(runMeasure(io, target, o)));

  registerCheck(program, io, setCode);
  registerReport(program, io, setCode);
  registerRender(program, io, setCode);
  return program;
}

/** Runs the CLI on argv (without node and script) and returns the exit code; never throws. */
export function runCli(argv: readonly string[], io: CliIo): number {
  let code = EXIT_OK;
  const program = buildProgram(io, (c) => (code = c));
  try {
    program.parse([...argv], { from: 'user' });
    return code;
  } catch (e) {
    if (e instanceof CommanderError) {
      // 'commander.help' is help shown because no command was given: a usage error.
      const quiet = e.code === 'commander.helpDisplayed' || e.code === 'commander.version';
      return quiet ? EXIT_OK : EXIT_BAD_INPUT;
    }
    if (e instanceof InputError) {
      io.err(`couplet: ${e.message}\n`);
      return EXIT_BAD_INPUT;
    }
    if (e instanceof MeasureFailed) {
      io.err(`couplet: ${e.message}\n`);
      return EXIT_MEASURE_FAILED;
    }
    io.err(`couplet: internal error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
    return EXIT_MEASURE_FAILED;
  }
}
