/**
 * Sidecar schema v1 (`schema: couplet-sidecar/1`): the plain-text record of a chemist's picks,
 * assignments and couplings, stored as `<data file name>.couplet.yaml` beside the spectrum.
 * SCHEMA.md beside this file is the full description; in short:
 *
 *   schema: couplet-sidecar/1
 *   data:
 *     file: cosy.jdx
 *     sha256: <64 lowercase hex digits of the data file>
 *
 *   picks:                        # sorted by id (natural order: digit runs compare as numbers)
 *     - id: p-4.1200-2.3400       # chosen at creation, never changed afterwards
 *       f2_ppm: 4.1200            # 4 decimals
 *       f1_ppm: 2.3400            # 4 decimals; absent for 1D data
 *       label: [H-3, H-4a]        # one atom label, a pair for a cross peak, [] while unassigned
 *       kind: cross               # optional: cross | diagonal | multiplet
 *       note: checked in 1D       # optional
 *     - id: p-3.8200              # a 1D multiplet may also carry:
 *       from_ppm: 3.8500          #   the region the chemist set (high to low ppm, 4 decimals)
 *       to_ppm: 3.7900
 *       protons: 1                #   the integral reference: this multiplet holds 1 proton
 *
 *   couplings:                    # sorted by atom pair, then method, then dimension
 *     - atoms: [H-3, H-4a]        # written in natural order
 *       j_hz: 10.20               # 2 decimals
 *       j_sd_hz: 0.15
 *       method: fit               # fit | naive | manual | 1d
 *       dimension: F2             # F2 | F1
 *       picks: [p-4.1200-2.3400]
 *       flags: []
 *       passive_hz: [4.50]        # optional
 *       linewidth_hz: 1.10        # optional
 *       note: ...                 # optional
 *
 * TypeScript fields are camelCase; the YAML keys are the snake_case names shown above.
 */

export const SCHEMA_ID = 'couplet-sidecar/1';
export const SCHEMA_PREFIX = 'couplet-sidecar/';

export type PickKind = 'cross' | 'diagonal' | 'multiplet';
export const PICK_KINDS: readonly PickKind[] = ['cross', 'diagonal', 'multiplet'];

export type CouplingMethod = 'fit' | 'naive' | 'manual' | '1d';
export const COUPLING_METHODS: readonly CouplingMethod[] = ['fit', 'naive', 'manual', '1d'];

export type Dimension = 'F2' | 'F1';
export const DIMENSIONS: readonly Dimension[] = ['F2', 'F1'];

export interface DataRef {
  /** Data file name, relative to the sidecar's folder. */
  file: string;
  /** SHA-256 of the data file's bytes, lowercase hex (computed by the caller; core does no I/O). */
  sha256: string;
}

export interface Pick {
  /** Stable id chosen at creation (see `pickIdFor`); couplings refer to it. */
  id: string;
  f2Ppm: number;
  /** Absent for 1D data. */
  f1Ppm?: number;
  /** Atom labels: one (diagonal, 1D multiplet), two (cross peak), none while unassigned. */
  label: string[];
  kind?: PickKind;
  /** 1D multiplet region set by the chemist, high to low ppm (both or neither; never with f1Ppm). */
  fromPpm?: number;
  toPpm?: number;
  /** 1D only: this multiplet is the integral reference and holds this many protons (at most one pick per sidecar). */
  protons?: number;
  note?: string;
}

/** Alias for modules that also need TypeScript's built-in `Pick<T, K>` (which `Pick` shadows on import). */
export type SidecarPick = Pick;

export interface Coupling {
  /** The two coupled atoms; the writer puts them in natural order. */
  atoms: [string, string];
  jHz: number;
  jSdHz: number;
  method: CouplingMethod;
  dimension: Dimension;
  /** Ids of the picks the value came from (may be empty for manual values). */
  picks: string[];
  /** Quality flags, e.g. unresolved, resolution-limited, second-order; written sorted. */
  flags: string[];
  passiveHz?: number[];
  linewidthHz?: number;
  note?: string;
}

export interface Sidecar {
  schema: typeof SCHEMA_ID;
  data: DataRef;
  picks: Pick[];
  couplings: Coupling[];
}

/** What identifies a coupling: one value per atom pair, method and dimension. */
export interface CouplingKey {
  atoms: [string, string];
  method: CouplingMethod;
  dimension: Dimension;
}

export type Severity = 'error' | 'warning' | 'info';

export type DiagnosticCode =
  | 'yaml-syntax'
  | 'conflict-marker'
  | 'unknown-schema'
  | 'future-schema'
  | 'missing-field'
  | 'wrong-type'
  | 'invalid-value'
  | 'unknown-field'
  | 'duplicate-pick-id'
  | 'duplicate-coupling'
  | 'unknown-pick'
  | 'data-hash-mismatch'
  | 'unsorted';

export interface SidecarDiagnostic {
  file: string;
  /** 1-based line. */
  line: number;
  /** 1-based column. */
  column: number;
  severity: Severity;
  code: DiagnosticCode;
  /** Says what and where: `<file>:<line>: <field path>: <problem>`. */
  message: string;
  /** Dotted field path, e.g. `picks[2].f2_ppm`, when the problem is in one field. */
  field?: string;
}

/** A replacement of `length` UTF-16 code units at `offset` (JS string indices) by `text`. */
export interface TextEdit {
  offset: number;
  length: number;
  text: string;
}
