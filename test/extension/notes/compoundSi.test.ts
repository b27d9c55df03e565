/**
 * The insert command's SI line for the three sample compounds (samples/*: note, sidecars, 1h.jdx),
 * built as the command builds it (compoundSi -> siText -> upsertRegion), pinned in a snapshot and
 * checked equal to what `couplet report` builds from the same folder (src/cli/report.ts).
 * The line's conventions are the core's (src/core/report/siLine.ts, common practice as stated in
 * ../shared/checks/references.md). On a mismatch it writes __snapshots__/siLines-changed.md.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseJcamp } from '../../../src/core/jcamp';
import { labelsInMarkdown } from '../../../src/core/notes/labels';
import { buildReports } from '../../../src/cli/report';
import type { CompoundReport } from '../../../src/core/report/compound';
import { compoundSi, multiplicities, readSources, siText } from '../../../src/extension/notes/compoundSi';
import { readFrontMatter } from '../../../src/core/notes/frontMatter';
import { upsertRegion } from '../../../src/extension/notes/siRegion';

const SAMPLES = join(__dirname, '..', '..', '..', 'samples');
const COMPOUNDS = ['brisquarene', 'quellopyranol', 'vantrelenol'];

interface Sample { note: string; si: CompoundReport }

function sample(c: string): Sample {
  const dir = join(SAMPLES, c);
  const sidecars = readdirSync(dir).filter((f) => f.endsWith('.couplet.yaml')).sort().map((f) => ({ fileName: f, text: readFileSync(join(dir, f), 'utf8') }));
  const note = readFileSync(join(dir, `${c}.md`), 'utf8');
  const s = parseJcamp(readFileSync(join(dir, '1h.jdx'), 'utf8'), '1h.jdx');
  if (s.dims !== 1) throw new Error(`${c}/1h.jdx is not 1D`);
  const front = readFrontMatter(note);
  // As the insert command does: every sidecar checked against its data file's SHA-256.
  const dataHashes = new Map(readSources(sidecars).sources.map((x) => [x.file, createHash('sha256').update(readFileSync(join(dir, x.sidecar.data.file))).digest('hex')]));
  return { note, si: compoundSi({ compound: front.compound ?? c, sidecars, spectrum1D: s, spectrum1DFile: '1h.jdx', solvent: front.solvent, noteLabels: labelsInMarkdown(note.slice(front.end)), dataHashes }) };
}

const apply = (t: string, e: { offset: number; length: number; text: string }): string => t.slice(0, e.offset) + e.text + t.slice(e.offset + e.length);

describe('SI line of the sample compounds, as the insert command writes it', () => {
  const samples = new Map(COMPOUNDS.map((c) => [c, sample(c)]));

  it('matches the stored lines (markdown and LaTeX) and notes', () => {
    const parts = COMPOUNDS.flatMap((c) => {
      const s = samples.get(c);
      if (!s) return [];
      const md = siText(s.si, 'markdown');
      return [`## ${c}`, '', md.line, '', siText(s.si, 'latex').line, '', ...md.notes.map((n) => `- ${n}`), ''];
    });
    const text = `${parts.join('\n')}`;
    const dir = join(__dirname, '__snapshots__');
    const file = join(dir, 'siLines.md');
    if (!existsSync(file)) {
      mkdirSync(dir, { recursive: true });
      writeFileSync(file, text);
    }
    if (readFileSync(file, 'utf8') !== text) {
      writeFileSync(join(dir, 'siLines-changed.md'), text);
      expect.fail('SI lines changed: compare __snapshots__/siLines-changed.md with siLines.md');
    }
  });

  it('writes the same line and notes as `couplet report` on the same folder', () => {
    for (const [c, s] of samples) {
      const [cli] = buildReports(join(SAMPLES, c));
      expect(siText(s.si, 'markdown').line).toBe(cli?.siLine.md);
      expect(siText(s.si, 'latex').line).toBe(cli?.siLine.tex);
      expect(siText(s.si, 'markdown').notes).toEqual(cli?.notes);
    }
  });

  it('refuses a sidecar whose data file changed (hash mismatch), as the report does', () => {
    const dir = join(SAMPLES, 'brisquarene');
    const sidecars = [{ fileName: 'cosy.jdx.couplet.yaml', text: readFileSync(join(dir, 'cosy.jdx.couplet.yaml'), 'utf8') }];
    expect(() => compoundSi({ compound: 'brisquarene', sidecars, observeMhz: 500.13, solvent: 'CDCl3', noteLabels: [], dataHashes: new Map([['cosy.jdx.couplet.yaml', 'f'.repeat(64)]]) }))
      .toThrow(/^not writing SI data from a sidecar with errors: cosy\.jdx\.couplet\.yaml:\d+: data\.sha256/);
  });

  it('inserts the line into each note once; a second run updates the region and changes nothing more', () => {
    for (const [c, s] of samples) {
      const { line } = siText(s.si, 'markdown');
      const once = apply(s.note, upsertRegion(s.note, s.note.length, 'markdown', 'H1', line, `${c}.md`));
      expect(once.split('<!-- couplet:si H1 begin -->')).toHaveLength(2);
      expect(once).toContain(`<!-- couplet:si H1 begin -->\n${line}\n<!-- couplet:si H1 end -->`);
      const twice = apply(once, upsertRegion(once, 0, 'markdown', 'H1', line, `${c}.md`));
      expect(twice).toBe(once);
    }
  });

  it('gives the hover the multiplicity the line writes for every label of the line', () => {
    for (const s of samples.values()) {
      const m = multiplicities(s.si);
      const { line } = siText(s.si, 'markdown');
      for (const [label, letters] of m) expect(line).toMatch(new RegExp(`\\((?:${letters.replace(/ /g, ' ')})(?:, [^()]*)?, ${label.replace(/[-]/g, '\\-')}[,)]`));
    }
  });
});
