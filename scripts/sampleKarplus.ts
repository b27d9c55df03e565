/**
 * The dihedral-estimate requests of the demo notes (`karplus:` front matter) and the sentence that
 * explains them, so that `npm run samples` writes them with the rest of each note. The ξ values
 * are read off the expected all-cis chair of quellopyranol (checked by test/core/notes/karplusSample.test.ts).
 */
const QUELLOPYRANOL = [
  '# Dihedral estimates for the ring pairs that decide axial vs equatorial (couplet report): the non-H',
  '# substituents of each H–C–C–H fragment and their ξ, worked out on the expected all-cis chair.',
  'karplus:',
  '  - pair: [H-2, H-3a]',
  '    substituents: [O, C, C]     # O-1 and C-7 on C-2; C-4 on C-3',
  '    orientation: [+1, -1, +1]',
  '  - pair: [H-3a, H-4]',
  '    substituents: [C, C, O]     # C-2 on C-3; C-5 and the OH on C-4',
  '    orientation: [-1, -1, +1]',
  '  - pair: [H-4, H-5a]',
  '    substituents: [C, O, C]     # C-3 and the OH on C-4; C-6 on C-5',
  '    orientation: [+1, -1, +1]',
  '  - pair: [H-5a, H-6]',
  '    substituents: [C, O, C]     # C-4 on C-5; O-1 and C-8 on C-6',
  '    orientation: [-1, -1, +1]',
];

const QUELLOPYRANOL_TEXT =
  'Dihedral estimates: the `karplus:` list in the front matter asks `couplet report` for the H–C–C–H angles of H-2/H-3a, ' +
  'H-3a/H-4, H-4/H-5a and H-5a/H-6 (about ±180° if both protons are axial, about ±60° if one is equatorial). Each ξ was read ' +
  'off a model of the expected chair: looking along the C–C bond from the substituent\'s own carbon, +1 when the substituent ' +
  'sits clockwise of that carbon\'s coupled proton, −1 when anticlockwise; the mirror-image chair flips every ξ and every φ, ' +
  'and an anti pair (φ near 180°) hardly depends on ξ. The angles are an aid to the argument, not a proof; they inherit ' +
  'every doubt about the J they come from.';

/** Front-matter lines of a compound's karplus requests ([] when it has none). */
export function karplusFrontMatter(id: string): string[] {
  return id === 'quellopyranol' ? QUELLOPYRANOL : [];
}

/** The paragraph that explains them ([] when none). */
export function karplusText(id: string): string[] {
  return id === 'quellopyranol' ? ['', QUELLOPYRANOL_TEXT] : [];
}
