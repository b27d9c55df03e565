/**
 * Writes the demo samples' sidecars as a chemist would after accepting every pick: the real
 * measurement (pickCrossPeaks + measurePair / measureCrossPeak, the same calls as `couplet measure
 * --all`) over each `cosy.jdx`, and the 1D multiplets of `1h.jdx`. truth.json is used ONLY to put
 * atom labels on what was picked, by shift (the nearest spin within 0.02 ppm, as a chemist assigns
 * by shift); every position, J, sd and flag is what the measurement produced, never a true value.
 * Deterministic (no time, no randomness). Usage: node dist/makeSidecars.js [samplesDir]
 */
import { createHash } from 'node:crypto';
import { readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseJcamp } from '../src/core/jcamp';
import { MeasureError, measureCrossPeak, measurePair } from '../src/core/measure';
import { pickCrossPeaks, pickMultiplets1D } from '../src/core/peaks';
import { formatSidecar, newSidecar, pickIdFor, type Coupling, type Sidecar } from '../src/core/sidecar';

const LABEL_TOL_PPM = 0.02;

interface TruthSpin {
  label: string;
  ppm: number;
}

function nearestLabel(spins: readonly TruthSpin[], ppm: number): string | null {
  let best: TruthSpin | null = null;
  for (const s of spins) if (!best || Math.abs(s.ppm - ppm) < Math.abs(best.ppm - ppm)) best = s;
  return best && Math.abs(best.ppm - ppm) <= LABEL_TOL_PPM ? best.label : null;
}

function load(path: string): { text: string; sha256: string } {
  const bytes = readFileSync(path);
  return { text: bytes.toString('latin1'), sha256: createHash('sha256').update(bytes).digest('hex') };
}

function cosySidecar(dir: string, spins: readonly TruthSpin[]): { sidecar: Sidecar; failures: string[] } {
  const { text, sha256 } = load(join(dir, 'cosy.jdx'));
  const s = parseJcamp(text, 'cosy.jdx');
  if (s.dims !== 2) throw new Error(`${dir}/cosy.jdx is not 2D`);
  const sc = newSidecar('cosy.jdx', sha256);
  const { peaks, noise } = pickCrossPeaks(s);
  const ids: (string | null)[] = peaks.map(() => null);
  const failures: string[] = [];
  peaks.forEach((p, i) => {
    if (p.kind !== 'cross') return;
    const a = nearestLabel(spins, p.f2Ppm);
    const b = nearestLabel(spins, p.f1Ppm);
    const label = a !== null && b !== null && a !== b ? [a, b] : [];
    const id = pickIdFor(sc, p.f2Ppm, p.f1Ppm);
    sc.picks.push({ id, f2Ppm: p.f2Ppm, f1Ppm: p.f1Ppm, label, kind: 'cross' });
    ids[i] = id;
  });
  const best = new Map<string, Coupling>();
  peaks.forEach((p, i) => {
    const id = ids[i];
    const pick = sc.picks.find((x) => x.id === id);
    // One measurement per symmetric pair: measured from the peak with the lower index, reconciled with its partner.
    if (!id || !pick || pick.label.length !== 2 || (p.partner !== null && p.partner < i)) return;
    const partner = p.partner === null ? undefined : peaks[p.partner];
    try {
      const m = partner ? measurePair(s, p, partner, { noise }) : measureCrossPeak(s, p, { noise });
      const partnerId = p.partner === null ? null : ids[p.partner];
      const c: Coupling = {
        atoms: [pick.label[0] ?? '', pick.label[1] ?? ''], jHz: m.jHz, jSdHz: m.jSdHz, method: m.method, dimension: m.dimension,
        picks: partnerId ? [id, partnerId] : [id], flags: [...new Set(m.flags)],
        ...(m.passiveHz.length > 0 && { passiveHz: m.passiveHz }),
        ...(m.linewidthHz > 0 && { linewidthHz: m.linewidthHz }),
      };
      const key = [...c.atoms].sort().join('\u0000');
      const old = best.get(key);
      if (!old || c.jSdHz < old.jSdHz) best.set(key, c);
    } catch (e) {
      if (!(e instanceof MeasureError)) throw e;
      failures.push(`${dir}/cosy.jdx F2 ${p.f2Ppm.toFixed(4)} F1 ${p.f1Ppm.toFixed(4)}: ${e.message}`);
    }
  });
  sc.couplings.push(...best.values());
  return { sidecar: sc, failures };
}

function oneDSidecar(dir: string, spins: readonly TruthSpin[]): Sidecar {
  const { text, sha256 } = load(join(dir, '1h.jdx'));
  const s = parseJcamp(text, '1h.jdx');
  if (s.dims !== 1) throw new Error(`${dir}/1h.jdx is not 1D`);
  const sc = newSidecar('1h.jdx', sha256);
  for (const m of pickMultiplets1D(s).multiplets) {
    // Only multiplets that hold exactly one spin's shift get a label; overlapped ones stay for the chemist.
    const inside = spins.filter((x) => x.ppm <= m.fromPpm + LABEL_TOL_PPM && x.ppm >= m.toPpm - LABEL_TOL_PPM);
    const label = inside.length === 1 && nearestLabel(spins, m.ppm) === inside[0]?.label ? [inside[0].label] : [];
    sc.picks.push({ id: pickIdFor(sc, m.ppm), f2Ppm: m.ppm, label, kind: 'multiplet' });
  }
  return sc;
}

function main(root: string): void {
  for (const name of readdirSync(root).sort()) {
    const dir = join(root, name);
    if (!statSync(dir).isDirectory()) continue;
    const truth = JSON.parse(readFileSync(join(dir, 'truth.json'), 'utf8')) as { system: { spins: TruthSpin[] } };
    const spins = truth.system.spins.map((x) => ({ label: x.label, ppm: x.ppm }));
    const { sidecar, failures } = cosySidecar(dir, spins);
    writeFileSync(join(dir, 'cosy.jdx.couplet.yaml'), formatSidecar(sidecar));
    writeFileSync(join(dir, '1h.jdx.couplet.yaml'), formatSidecar(oneDSidecar(dir, spins)));
    const labelled = sidecar.picks.filter((p) => p.label.length === 2).length;
    process.stdout.write(`${dir}: ${sidecar.picks.length} cross peaks (${labelled} labelled), ${sidecar.couplings.length} couplings\n`);
    for (const f of failures) process.stdout.write(`  not measured: ${f}\n`);
  }
}

main(process.argv[2] ?? 'samples');
