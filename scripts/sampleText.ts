/** Markdown for the demo scenario: the samples README and one structure note per compound. */
import type { SampleCompound } from './sampleScenario';
import { karplusFrontMatter, karplusText } from './sampleKarplus';
import { structureFrontMatter } from './sampleStructures';

export function structureNote(c: SampleCompound): string {
  const rows = c.environments.map(([label, env]) => `| ${label} | ${env} |`);
  return [
    '---',
    `compound: ${c.id}`,
    // The SI line's header names the solvent (couplet report, Insert ¹H NMR Data); the story's spectra are in CDCl3.
    'solvent: CDCl3',
    // The molfile and label -> H atom numbers for the NMReDATA export (scripts/sampleStructures.ts).
    ...structureFrontMatter(c.id),
    ...karplusFrontMatter(c.id),
    '---',
    '',
    `# ${c.name}`,
    '',
    c.description,
    '',
    'Proton labels used in the spectra and sidecars:',
    '',
    '| label | expected environment |',
    '|---|---|',
    ...rows,
    '',
    'Coupling constants: to be measured from `cosy.jdx` (checked against `1h.jdx`).',
    ...karplusText(c.id),
    '',
  ].join('\n');
}

export function readmeText(group: string, project: string, compounds: readonly SampleCompound[]): string {
  const list = compounds.map((c) => {
    const mhz = c.system.observeMhz;
    return `- \`${c.id}/\`: ${c.name} at ${mhz} MHz; 1D ${c.oneD.size} points, DQF-COSY ${c.cosy.f1.size} x ${c.cosy.f2.size} (F1 x F2).`;
  });
  return [
    '# Demo samples (invented)',
    '',
    `Everything here is invented: ${group} and its ${project} do not exist,`,
    'and neither do the compounds. In the story, the group has made three new building blocks and needs their proton',
    'couplings to assign relative configuration and olefin geometry; it measures them with Couplet and',
    'keeps the results in git next to the structure notes.',
    '',
    ...list,
    '',
    'Each folder holds:',
    '',
    '- `<compound>.md`: the structure note (YAML front matter `compound: <id>`, proton labels and their',
    '  expected environments; no J values: measuring them is the point);',
    '- `1h.jdx`: the 1D ¹H spectrum (JCAMP-DX 5.01, `##XYDATA=`);',
    '- `cosy.jdx`: the phase-sensitive DQF-COSY (JCAMP-DX 6.00 NTUPLES, one page per F1 row);',
    '- `truth.json`: the parameters the spectra were simulated from (shifts, widths, couplings, processing,',
    '  noise seeds). A real dataset has no such file; it is here for tests and for an honest comparison of',
    '  measured and true values.',
    '',
    'The spectra are simulated by Couplet\'s own first-order simulator (`src/core/simulate/`):',
    'time-domain signals with T2 decay, seeded Gaussian noise added to the FIDs, squared-cosine windows,',
    'zero-filling and Fourier transformation; the DQF-COSY cross peaks are antiphase in the active and',
    'in-phase in the passive couplings. Regenerate them, byte for byte, with `npm run samples`.',
    '',
    'What the data are meant to exercise:',
    '',
    '- large, clear couplings (ring axial-axial, olefinic trans, aromatic ortho);',
    '- couplings at or below the linewidth, which the antiphase cross peaks cannot resolve (W-type and',
    '  allylic 4J, aromatic para);',
    '- pairs with shift difference / J below 10 (quellopyranol H-5a/H-5b and H-8a/H-8b, vantrelenol',
    '  H-3/H-4). The simulation is first-order even there, so the true spectrum of such a pair would',
    '  differ (roofing, extra lines); the quality flag, not the simulator, is what should warn.',
    '',
  ].join('\n');
}
