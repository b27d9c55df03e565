/**
 * JCAMP-DX for NMR: read 1D (`##XYDATA=`, NTUPLES real/imaginary pages) and 2D spectra (nD NMR
 * NTUPLES, one `##PAGE= F1=` per row) in every ASDF form, and write them back (DIFDUP or AFFN).
 * Decisions, each documented where it is made:
 * - `?` (missing ordinate) is rejected with its line (asdf.ts): no NaN ever enters a spectrum.
 * - X check tolerance: the precision written, but at least half a point spacing (pages.ts).
 * - `##.SHIFT REFERENCE=` moves a 1D axis when it names a point inside the data (build.ts).
 * - The writer quantises to integers x FACTOR = max|y| / 2^20; reading gives exactly those (writer.ts).
 * - Processing is kept in our private `##$COUPLET PROCESSING=` labels (processingLabel.ts).
 */
import type { Spectrum } from '../spectrum/spectrum';
import { findLabel, readJcampBlocks, type JcampBlock, type JcampFile } from './blocks';
import { buildSpectrum, isNmrSpectrum } from './build';
import { JcampError } from './errors';

export { JcampError } from './errors';
export { readJcampBlocks, findLabel, type JcampBlock, type JcampFile } from './blocks';
export type { DecodedPage } from './pages';
export type { LabelledRecord } from './tokenize';
export { normaliseLabel } from './labels';
export { writeJcamp1D, writeJcamp2D, type JcampWriteOptions } from './writer';
export { formatProcessing, parseProcessing } from './processingLabel';

export interface ParseOptions {
  /** Index of the data block to read (0-based, LINK containers not counted). */
  readonly block?: number;
  /** Or the block whose `##BLOCK_ID=` equals this. */
  readonly blockId?: string;
}

/**
 * Read a 1D or 2D NMR spectrum from JCAMP-DX text. Without options, the first block holding NMR
 * spectrum data is used. Throws JcampError (with file, line and label) on any problem.
 */
export function parseJcamp(text: string, fileName: string, opts?: ParseOptions): Spectrum {
  const file = readJcampBlocks(text, fileName);
  return buildSpectrum(pickBlock(file, opts), fileName);
}

function pickBlock(file: JcampFile, opts: ParseOptions | undefined): JcampBlock {
  const { blocks, fileName } = file;
  if (opts?.block !== undefined) {
    const b = blocks[opts.block];
    if (!b) throw new JcampError(fileName, 1, `no block ${opts.block}: the file has ${blocks.length} data block(s), numbered from 0`);
    return b;
  }
  if (opts?.blockId !== undefined) {
    const b = blocks.find((x) => x.blockId === opts.blockId);
    if (!b) throw new JcampError(fileName, 1, `no block with ##BLOCK_ID= ${opts.blockId}`, 'BLOCKID');
    return b;
  }
  const nmr = blocks.find(isNmrSpectrum);
  if (nmr) return nmr;
  // No NMR spectrum: report on the first block with data (its DATA TYPE says why), else the first.
  const first = blocks.find((b) => b.pages.length > 0) ?? blocks.find((b) => findLabel(b, 'DATATYPE')) ?? blocks[0];
  if (!first) throw new JcampError(fileName, 1, 'no data block');
  return first;
}
