import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectSnapshot, run } from './helpers';
import { renderSvg } from '../../src/cli/render';
import { formatSidecar, type Sidecar } from '../../src/core/sidecar';

const samples = resolve(__dirname, '..', '..', 'samples');
let dir = '';
let data = '';
const size = { width: 640, height: 480 };


function git(...args: string[]): void {
  const r = spawnSync('git', args, { cwd: dir, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`git ${args.join(' ')}: ${r.stderr}`);
}

/** Our own picks on the brisquarene sample (positions near its cross peaks; values invented for the picture). */
function before(): Sidecar {
  return {
    schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: createHash('sha256').update(readFileSync(data)).digest('hex') },
    picks: [
      { id: 'p-6.8600-7.2100', f2Ppm: 6.86, f1Ppm: 7.21, label: ['H-6', 'H-5'], kind: 'cross' },
      { id: 'p-7.2100-6.8600', f2Ppm: 7.21, f1Ppm: 6.86, label: ['H-5', 'H-6'], kind: 'cross' },
      { id: 'p-7.2100-7.3800', f2Ppm: 7.21, f1Ppm: 7.38, label: ['H-5', 'H-3'], kind: 'cross' },
      { id: 'p-7.3600-7.2000', f2Ppm: 7.36, f1Ppm: 7.2, label: ['H-3', 'H-6'], kind: 'cross' },
    ],
    couplings: [
      { atoms: ['H-3', 'H-5'], jHz: 2.31, jSdHz: 0.08, method: 'fit', dimension: 'F2', picks: ['p-7.2100-7.3800'], flags: [] },
      { atoms: ['H-5', 'H-6'], jHz: 8.47, jSdHz: 0.05, method: 'fit', dimension: 'F2', picks: ['p-7.2100-6.8600'], flags: [] },
    ],
  };
}

/** Every kind of change: one added, one removed, one moved and relabelled, one re-measured (and one coupling citing the moved pick: amended). */
function after(): Sidecar {
  const b = before();
  return {
    ...b,
    picks: [
      { id: 'p-6.8600-7.2100', f2Ppm: 6.86, f1Ppm: 7.21, label: ['H-6', 'H-5'], kind: 'cross' },
      { id: 'p-7.2100-6.8600', f2Ppm: 7.21, f1Ppm: 6.86, label: ['H-5', 'H-6'], kind: 'cross' },
      { id: 'p-7.3600-7.2000', f2Ppm: 7.38, f1Ppm: 7.21, label: ['H-3', 'H-5'], kind: 'cross' },
      { id: 'p-7.3800-6.8600', f2Ppm: 7.38, f1Ppm: 6.86, label: ['H-3', 'H-6'], kind: 'cross' },
    ],
    couplings: [
      { atoms: ['H-3', 'H-5'], jHz: 2.31, jSdHz: 0.08, method: 'fit', dimension: 'F2', picks: ['p-7.3600-7.2000'], flags: [] },
      { atoms: ['H-5', 'H-6'], jHz: 8.52, jSdHz: 0.04, method: 'fit', dimension: 'F2', picks: ['p-7.2100-6.8600'], flags: [] },
    ],
  };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'couplet-render-'));
  data = join(dir, 'cosy.jdx');
  copyFileSync(join(samples, 'brisquarene', 'cosy.jdx'), data);
  for (const args of [['init', '-q', '-b', 'main'], ['config', 'user.name', 'Test'], ['config', 'user.email', 'test@example.invalid'], ['config', 'commit.gpgsign', 'false']]) git(...args);
  writeFileSync(`${data}.couplet.yaml`, formatSidecar(before()));
  git('add', 'cosy.jdx.couplet.yaml');
  git('commit', '-q', '-m', 'picks');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('couplet render', () => {
  it('draws the brisquarene sample with its picks and J values (snapshot)', () => {
    writeFileSync(`${data}.couplet.yaml`, formatSidecar(before()));
    const svg = renderSvg(data, size);
    expect(svg).toContain('J 8.47±0.05 Hz');
    expect(svg).toContain('>H-5/H-3<');
    expectSnapshot('brisquarenePicks', 'svg', svg, 'picture');
  });

  it('overlays the changes since HEAD, each kind distinct, with a legend and a list (snapshot)', () => {
    writeFileSync(`${data}.couplet.yaml`, formatSidecar(after()));
    const svg = renderSvg(data, { ...size, compare: 'HEAD' });
    for (const s of ['(removed)', 'marker-end="url(#couplet-arrow)"', 'was H-3/H-6', 'was 8.47±0.05 Hz', 'changes since HEAD: 6',
      'moved 7.3600/7.2000 -&gt;', 're-measured: 8.47 ± 0.05 Hz']) {
      expect(svg).toContain(s);
    }
    expectSnapshot('brisquareneCompare', 'svg', svg, 'picture');
  });

  it('puts high F2 ppm on the left (tick labels fall from left to right)', () => {
    const svg = renderSvg(data, size);
    const ticks = [...svg.matchAll(/<text x="([\d.]+)" y="([\d.]+)" text-anchor="middle" fill="#333333">([\d.]+)<\/text>/g)]
      .map((m) => [Number(m[1]), Number(m[3])] as const).sort((a, b) => a[0] - b[0]);
    expect(ticks.length).toBeGreaterThan(3);
    for (let i = 1; i < ticks.length; i++) expect(ticks[i]![1]).toBeLessThan(ticks[i - 1]![1]);
  });

  it('writes a PNG of the stated size (ISO/IEC 15948: signature, then IHDR with width and height)', () => {
    const out = join(dir, 'picks.png');
    const r = run('render', data, '--out', out, '--width', '420', '--height', '300');
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const png = readFileSync(out);
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.readUInt32BE(8)).toBe(13); // IHDR data length
    expect(png.subarray(12, 16).toString('latin1')).toBe('IHDR');
    expect(png.readUInt32BE(16)).toBe(420);
    expect(png.readUInt32BE(20)).toBe(300);
  });

  it('rejects a revision the repository does not have, an unknown picture type, and a 1D file (exit 2)', () => {
    const r = run('render', data, '--compare', 'no-such-rev', '--out', join(dir, 'x.svg'));
    expect(r.code).toBe(2);
    expect(r.err).toContain('no-such-rev: no such revision');
    expect(run('render', data, '--out', join(dir, 'x.gif')).code).toBe(2);
    expect(run('render', join(samples, 'brisquarene', '1h.jdx')).err).toContain('1D');
  });
});
