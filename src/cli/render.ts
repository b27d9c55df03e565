/**
 * `couplet render FILE [--out picks.svg|picks.png] [--compare REV]`: the spectrum with its
 * contours and the sidecar's picks, labels and J values; with --compare the changes since REV
 * (read with `git show`). SVG is written as text (src/core/review/svg.ts); PNG through resvg.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { basename } from 'node:path';
import { InvalidArgumentError, type Command } from 'commander';
import { compareSidecars, type SidecarChanges } from '../core/review/compare';
import { renderPicture } from '../core/review/svg';
import { firstPpm, lastPpm } from '../core/spectrum';
import { parseSidecar, sidecarNameFor, type Sidecar } from '../core/sidecar';
import { spectrumContours } from './contourData';
import { EXIT_OK, InputError } from './errors';
import { showAtRevision } from './gitShow';
import { loadSpectrum, type CliIo } from './io';

export interface RenderOptions {
  readonly width: number;
  readonly height: number;
  readonly compare?: string;
}

function readSidecar(path: string, text: string, what: string): Sidecar {
  const r = parseSidecar(text, path);
  if (r.sidecar === null) {
    const first = r.diagnostics.find((d) => d.severity === 'error');
    throw new InputError(`${what}: ${first?.message ?? `${path} cannot be read as a sidecar`}`);
  }
  return r.sidecar;
}

/** The picture of FILE (and its sidecar beside it, when there is one) as SVG text. */
export function renderSvg(file: string, o: RenderOptions): string {
  const s = loadSpectrum(file);
  if (s.dims !== 2) throw new InputError(`${file}: render draws 2D spectra; this file is 1D`);
  const sidecarPath = sidecarNameFor(file);
  const now = existsSync(sidecarPath) ? readSidecar(sidecarPath, readFileSync(sidecarPath, 'utf8'), sidecarPath) : null;
  let changes: SidecarChanges | undefined;
  if (o.compare !== undefined) {
    if (now === null) throw new InputError(`${file}: no sidecar ${basename(sidecarPath)} to compare`);
    const old = showAtRevision(sidecarPath, o.compare);
    changes = compareSidecars(old.kind === 'found' ? readSidecar(sidecarPath, old.text, `${o.compare}:${basename(sidecarPath)}`) : null, now);
  }
  // Plot area is the picture less the margins and side panel; about one grid cell per 1.5 pixels.
  const cols = Math.max(16, Math.round((o.width - 306) / 1.5));
  const rows = Math.max(16, Math.round((o.height - 76) / 1.5));
  return renderPicture({
    title: `${basename(file)}${o.compare === undefined ? '' : ` compared with ${o.compare}`}`,
    width: o.width, height: o.height,
    view: { f2: [firstPpm(s.f2), lastPpm(s.f2)], f1: [firstPpm(s.f1), lastPpm(s.f1)] },
    contours: spectrumContours(s, cols, rows),
    sidecar: now,
    ...(changes !== undefined && { changes, compareWith: o.compare }),
  });
}

interface ResvgModule {
  Resvg: new (svg: string, opts?: object) => { render(): { asPng(): Buffer; width: number; height: number } };
}

/** PNG bytes of an SVG picture, at its own size. Loaded on demand: the other commands do not need the native module. */
export function svgToPng(svg: string): Buffer {
  let mod: ResvgModule;
  try {
    mod = createRequire(__filename)('@resvg/resvg-js') as ResvgModule;
  } catch (e) {
    throw new InputError(`PNG output needs the @resvg/resvg-js package (${e instanceof Error ? e.message.split('\n')[0] : String(e)}); write .svg instead`);
  }
  return new mod.Resvg(svg, { fitTo: { mode: 'original' }, font: { loadSystemFonts: true } }).render().asPng();
}

function sizeArg(value: string): number {
  const v = Number(value);
  if (!Number.isInteger(v) || v < 200 || v > 8000) throw new InvalidArgumentError(`'${value}' is not a whole number of pixels from 200 to 8000`);
  return v;
}

export function registerRender(program: Command, io: CliIo, setCode: (code: number) => void): void {
  program
    .command('render')
    .description('the spectrum with its picks, labels and J values as SVG or PNG; --compare REV shows what changed since REV')
    .argument('<file>', 'JCAMP-DX 2D spectrum (its sidecar beside it is drawn when present)')
    .option('--out <path>', 'write to a .svg or .png file (default: SVG on standard output)')
    .option('--compare <rev>', 'overlay the changes since this git revision (branch, tag, commit, HEAD~1, ...)')
    .option('--width <px>', 'picture width', sizeArg, 900)
    .option('--height <px>', 'picture height', sizeArg, 640)
    .action((file: string, o: { out?: string; compare?: string; width: number; height: number }) => {
      const out = o.out;
      if (out !== undefined && !/\.(svg|png)$/i.test(out)) throw new InputError(`${out}: --out must end in .svg or .png`);
      const svg = renderSvg(file, { width: o.width, height: o.height, ...(o.compare !== undefined && { compare: o.compare }) });
      if (out === undefined) io.out(svg);
      else writeFileSync(out, /\.png$/i.test(out) ? svgToPng(svg) : svg);
      setCode(EXIT_OK);
    });
}
