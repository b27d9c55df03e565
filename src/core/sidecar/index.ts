/** The sidecar: the plain-text record of picks, assignments and couplings (see SCHEMA.md). */
import { SCHEMA_ID, type Sidecar } from './types';

export * from './types';
export { parseSidecar, isWritable, type ParseOptions, type ParseResult } from './parse';
export { formatSidecar, normalizeSidecar } from './format';
export { applyEdits, lineDiffEdits } from './lineDiff';
export {
  addPick, movePick, relabelPick, removePick, setCoupling, removeCoupling, setDataHash, pickIdFor, setPickRegion,
  setIntegralReference,
  type NewPick,
} from './edits';
export { toFixedDecimal, naturalCompare } from './decimal';
export { compareCouplings, comparePicks, couplingKeyString } from './order';

const SIDECAR_SUFFIX = '.couplet.yaml';

/** `cosy.jdx` -> `cosy.jdx.couplet.yaml` (the data file's full name, folder kept). */
export function sidecarNameFor(dataFileName: string): string {
  if (dataFileName === '' || /[\\/]$/.test(dataFileName)) throw new Error(`"${dataFileName}" is not a data file name`);
  return `${dataFileName}${SIDECAR_SUFFIX}`;
}

/** An empty sidecar for a data file (its base name is recorded; the hash comes from the caller). */
export function newSidecar(dataFileName: string, sha256Hex: string): Sidecar {
  const file = dataFileName.split(/[\\/]/).pop() ?? '';
  const sha256 = sha256Hex.toLowerCase();
  if (file === '') throw new Error(`"${dataFileName}" is not a data file name`);
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error(`"${sha256Hex}" is not a SHA-256 hex digest (64 hex digits)`);
  return { schema: SCHEMA_ID, data: { file, sha256 }, picks: [], couplings: [] };
}
