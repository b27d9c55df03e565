/**
 * Every message between the extension host and the Couplet webview, in one place.
 * The webview starts with `ready`; the host answers `init`. Requests carry an `id`; their replies
 * carry `inReplyTo` with that id (the same helper serves the fit worker). Incoming messages are
 * validated with `parseFromWebview` / `parseToWebview` before use: a webview is a separate
 * process and a stale or damaged message must not reach the host's logic.
 */
import { isMeasurementView, isMultipletView, isNum, isObj, isPeakView, isSidecarView, isSpectrumMeta, isStr, isStrList } from './protocolShapes';

/** One axis as the webview needs it (ppm = Hz / observeMhz). */
export interface AxisMeta {
  readonly points: number;
  readonly firstHz: number;
  readonly lastHz: number;
  readonly observeMhz: number;
}

/** Inclusive index ranges on the stored grid (rows = F1 points, cols = F2 points; 1D: one row). */
export interface GridRegion {
  readonly row0: number;
  readonly row1: number;
  readonly col0: number;
  readonly col1: number;
}

export interface SpectrumMeta {
  readonly fileName: string;
  readonly title: string;
  readonly dims: 1 | 2;
  /** Indirect dimension; absent for 1D. */
  readonly f1?: AxisMeta;
  /** Direct dimension (the only axis of a 1D spectrum). */
  readonly f2: AxisMeta;
  /** Noise standard deviation in data units (contour levels are multiples of it). */
  readonly noise: number;
  readonly min: number;
  readonly max: number;
}

export interface ContourSettings {
  /** Lowest contour level, in multiples of the noise sigma. */
  readonly lowestLevel: number;
  /** Number of levels on each sign. */
  readonly levels: number;
  /** Ratio between successive levels (> 1). */
  readonly spacing: number;
}

export interface ViewSettings {
  readonly contours: ContourSettings;
  readonly defaultMethod: 'fit' | 'naive';
  /** Decimals shown for J (Hz). */
  readonly jDecimals: number;
}

/** A cross, diagonal or 1D peak the core found; the webview snaps clicks to these. */
export interface PeakView {
  readonly index: number;
  readonly kind: 'cross' | 'diagonal' | 'multiplet';
  readonly f2Ppm: number;
  readonly f1Ppm?: number;
  readonly extent: { readonly f2FromPpm: number; readonly f2ToPpm: number; readonly f1FromPpm?: number; readonly f1ToPpm?: number };
  readonly partner: number | null;
}

/** A pick as stored in the sidecar (labels are atom labels such as H-3). */
export interface PickView {
  readonly id: string;
  readonly f2Ppm: number;
  readonly f1Ppm?: number;
  readonly label: readonly string[];
  readonly kind?: 'cross' | 'diagonal' | 'multiplet';
  /** 1D multiplet: the region the chemist set (high, low ppm), when set. */
  readonly fromPpm?: number;
  readonly toPpm?: number;
  /** 1D multiplet: this pick is the integral reference and holds that many protons. */
  readonly protons?: number;
}

export interface CouplingView {
  readonly atoms: readonly [string, string];
  readonly jHz: number;
  readonly jSdHz: number;
  readonly method: string;
  readonly dimension: 'F2' | 'F1';
  readonly picks: readonly string[];
  readonly flags: readonly string[];
}

/** The sidecar as the panel shows it; `blocked` explains why edits are refused (e.g. conflict markers). */
export interface SidecarView {
  readonly picks: readonly PickView[];
  readonly couplings: readonly CouplingView[];
  readonly blocked: string | null;
}

export interface TraceView {
  readonly f1Ppm: number;
  readonly fromPpm: number;
  readonly toPpm: number;
  readonly data: Float32Array;
  readonly fitted: Float32Array;
  readonly residual: Float32Array;
}

export interface MeasurementView {
  readonly peakIndex: number;
  readonly jHz: number;
  readonly jSdHz: number;
  readonly passiveHz: readonly number[];
  readonly linewidthHz: number;
  readonly method: 'fit' | 'naive';
  readonly dimension: 'F2' | 'F1';
  readonly flags: readonly string[];
  readonly notes: readonly string[];
  readonly traces: readonly TraceView[];
}

/** One COSY value checked against the 1D splitting nearest to it. */
export interface CosyCheckView {
  readonly partner: string;
  readonly cosyJHz: number;
  readonly cosySdHz: number;
  readonly oneDJHz: number;
  readonly oneDSdHz: number;
  readonly agrees: boolean;
}

/** The analysis of a 1D multiplet as the panel shows it (multipletView.ts builds it on the host). */
export interface MultipletView {
  readonly peakIndex: number;
  /** The sidecar pick on this multiplet, if any. */
  readonly pickId: string | null;
  readonly label: readonly string[];
  readonly centrePpm: number;
  /** The region analysed, high then low ppm; `regionSet` true when it is the pick's own, false when automatic. */
  readonly fromPpm: number;
  readonly toPpm: number;
  readonly regionSet: boolean;
  readonly integral: number;
  /** Protons relative to the reference pick; null without a reference. */
  readonly protons: number | null;
  /** e.g. `reference p-1.1700 (H-7) = 3 H`, `this pick is the reference (3 H)`, or `no reference`. */
  readonly reference: string;
  readonly multiplicity: string;
  /** Reportable couplings (empty when a flag says a first-order J would be wrong). */
  readonly couplings: readonly { readonly jHz: number; readonly sdHz: number; readonly count: number }[];
  readonly flags: readonly string[];
  /** Plain-language notes: each flag explained, then the analysis's own notes. */
  readonly notes: readonly string[];
  readonly cosy: readonly CosyCheckView[];
  /** Partners whose COSY J was looked up (atom labels), so the panel can say when there were none. */
  readonly partners: readonly string[];
  /** Fitted line positions (ppm), for ticks over the trace; empty without a fit or when no J is reported. */
  readonly linesPpm: readonly number[];
  /** The fitted lineshape (model plus baseline) over the region, when there is a fit. */
  readonly fitted: { readonly fromPpm: number; readonly toPpm: number; readonly data: Float32Array } | null;
}

// ---- host -> webview ------------------------------------------------------------------------

/** Answer to `ready`: everything needed to draw the first frame. */
export interface InitMessage {
  readonly type: 'init';
  readonly spectrum: SpectrumMeta;
  readonly settings: ViewSettings;
  readonly peaks: readonly PeakView[];
  readonly sidecar: SidecarView;
  /** Atom labels used in the workspace's structure notes and sidecars, for completion. */
  readonly knownLabels: readonly string[];
}

/** Data for a region, decimated to at most the requested size (max |value| per cell keeps peaks). */
export interface TileMessage {
  readonly type: 'tile';
  readonly inReplyTo: number;
  readonly region: GridRegion;
  readonly rows: number;
  readonly cols: number;
  /** Row-major, rows x cols. Sent as a typed array (structured clone), never as JSON numbers. */
  readonly data: Float32Array;
}

/** The sidecar changed (an edit, undo, revert, or a change on disk such as a checkout). */
export interface SidecarMessage {
  readonly type: 'sidecar';
  readonly sidecar: SidecarView;
}

export interface MeasuredMessage {
  readonly type: 'measured';
  readonly inReplyTo: number;
  readonly measurement: MeasurementView;
}

/** Reply to `analyse`: the 1D multiplet's analysis. */
export interface AnalysedMessage {
  readonly type: 'analysed';
  readonly inReplyTo: number;
  readonly analysis: MultipletView;
}

export interface ProgressMessage {
  readonly type: 'progress';
  readonly task: string;
  readonly done: number;
  readonly total: number;
}

export interface ErrorMessage {
  readonly type: 'error';
  readonly inReplyTo?: number;
  readonly message: string;
  /** The request was cancelled (Esc, the cancel button), not failed: no "record without J" offer. */
  readonly cancelled?: true;
}

/** A command from the palette or a keybinding that the panel carries out (next peak, zoom...). */
export interface CommandMessage {
  readonly type: 'command';
  readonly command: 'nextPeak' | 'previousPeak' | 'measure' | 'accept' | 'label' | 'removePick' | 'zoomToPeak' | 'resetZoom';
}

/** The user changed a `couplet.*` setting while the panel is open: the new values replace init's. */
export interface SettingsMessage {
  readonly type: 'settings';
  readonly settings: ViewSettings;
}

/** One change since another revision of the sidecar, as the panel overlays and lists it. */
export interface ReviewMarkView {
  readonly kind: 'added' | 'removed' | 'moved' | 'relabelled' | 're-measured' | 'other';
  /** One line for the list, e.g. `pick p-4.12-2.34 relabelled H-3/H-4a -> H-3/H-4b`. */
  readonly text: string;
  /** Where to show it (a removed pick: where it was); absent for a change with no place (a manual J). */
  readonly f2Ppm?: number;
  readonly f1Ppm?: number;
  /** A moved pick's old place (the arrow starts here). */
  readonly fromF2Ppm?: number;
  readonly fromF1Ppm?: number;
}

/** Overlay the changes since `against` (HEAD, a branch, a commit); `against` null clears the overlay. */
export interface CompareMessage {
  readonly type: 'compare';
  readonly against: string | null;
  readonly marks: readonly ReviewMarkView[];
}

export type ToWebview = InitMessage | TileMessage | SidecarMessage | MeasuredMessage | AnalysedMessage | ProgressMessage | ErrorMessage | CommandMessage | SettingsMessage | CompareMessage;

// ---- webview -> host ------------------------------------------------------------------------

export interface ReadyMessage {
  readonly type: 'ready';
}

export interface TileRequest {
  readonly type: 'requestTile';
  readonly id: number;
  readonly region: GridRegion;
  /** The most rows and columns the view can use (screen resolution). */
  readonly maxRows: number;
  readonly maxCols: number;
}

export interface MeasureRequest {
  readonly type: 'measure';
  readonly id: number;
  readonly peakIndex: number;
  readonly method: 'fit' | 'naive';
  readonly dimension: 'F2' | 'F1';
}

/** Record the measurement shown for this peak as a pick plus a coupling in the sidecar. */
export interface AcceptRequest {
  readonly type: 'accept';
  readonly peakIndex: number;
  readonly method: 'fit' | 'naive';
  readonly dimension: 'F2' | 'F1';
  /** [F2 atom, F1 atom] for a cross peak; may be empty until labelled. */
  readonly labels: readonly string[];
}

export interface LabelRequest {
  readonly type: 'label';
  readonly pickId: string;
  readonly labels: readonly string[];
}

export interface RemovePickRequest {
  readonly type: 'removePick';
  readonly pickId: string;
}

export interface MeasureAllRequest {
  readonly type: 'measureAll';
  readonly method: 'fit' | 'naive';
}

/** 1D: analyse the multiplet (also tells the host which multiplet the palette commands act on). */
export interface AnalyseRequest {
  readonly type: 'analyse';
  readonly id: number;
  readonly peakIndex: number;
}

/**
 * 1D: set a multiplet region (Shift+drag). `peakIndex` is the multiplet whose pick gets it (a new
 * pick when it has none); null names no multiplet, which the host refuses (the panel does not send it).
 */
export interface SetRegionRequest {
  readonly type: 'setRegion';
  readonly peakIndex: number | null;
  readonly fromPpm: number;
  readonly toPpm: number;
}

export interface CancelRequest {
  readonly type: 'cancel';
}

export type FromWebview = ReadyMessage | TileRequest | MeasureRequest | AcceptRequest | LabelRequest | RemovePickRequest | MeasureAllRequest | AnalyseRequest | SetRegionRequest | CancelRequest;

// ---- validation -----------------------------------------------------------------------------

export type Parsed<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: string };

type Obj = Record<string, unknown>;

const isInt = (v: unknown): v is number => typeof v === 'number' && Number.isInteger(v);
const isNonNegInt = (v: unknown): v is number => isInt(v) && v >= 0;
const isPosInt = (v: unknown): v is number => isInt(v) && v > 0;
const isMethod = (v: unknown): v is 'fit' | 'naive' => v === 'fit' || v === 'naive';
const isDim = (v: unknown): v is 'F2' | 'F1' => v === 'F2' || v === 'F1';

/** Shapes only; the webview still checks the contour values' ranges (checkContourSettings). */
function isViewSettings(v: unknown): v is ViewSettings {
  return isObj(v) && isObj(v.contours) && isNum(v.contours.lowestLevel) && isPosInt(v.contours.levels) && isNum(v.contours.spacing)
    && isMethod(v.defaultMethod) && isNonNegInt(v.jDecimals);
}

const MARK_KINDS: readonly string[] = ['added', 'removed', 'moved', 'relabelled', 're-measured', 'other'];
const isOptNum = (v: unknown): boolean => v === undefined || isNum(v);

function isReviewMark(v: unknown): v is ReviewMarkView {
  return isObj(v) && isStr(v.kind) && MARK_KINDS.includes(v.kind) && isStr(v.text)
    && isOptNum(v.f2Ppm) && isOptNum(v.f1Ppm) && isOptNum(v.fromF2Ppm) && isOptNum(v.fromF1Ppm);
}

function isRegion(v: unknown): v is GridRegion {
  return isObj(v) && isNonNegInt(v.row0) && isNonNegInt(v.row1) && isNonNegInt(v.col0) && isNonNegInt(v.col1) && v.row0 <= v.row1 && v.col0 <= v.col1;
}

/** Field checks per webview message type: each returns the name of the first bad field, or null. */
const FROM_WEBVIEW: Record<FromWebview['type'], (m: Obj) => string | null> = {
  ready: () => null,
  requestTile: (m) => (!isNonNegInt(m.id) ? 'id' : !isRegion(m.region) ? 'region' : !isPosInt(m.maxRows) ? 'maxRows' : !isPosInt(m.maxCols) ? 'maxCols' : null),
  measure: (m) => (!isNonNegInt(m.id) ? 'id' : !isNonNegInt(m.peakIndex) ? 'peakIndex' : !isMethod(m.method) ? 'method' : !isDim(m.dimension) ? 'dimension' : null),
  accept: (m) => (!isNonNegInt(m.peakIndex) ? 'peakIndex' : !isMethod(m.method) ? 'method' : !isDim(m.dimension) ? 'dimension' : !isStrList(m.labels) ? 'labels' : null),
  label: (m) => (!isStr(m.pickId) ? 'pickId' : !isStrList(m.labels) ? 'labels' : null),
  removePick: (m) => (!isStr(m.pickId) ? 'pickId' : null),
  measureAll: (m) => (!isMethod(m.method) ? 'method' : null),
  analyse: (m) => (!isNonNegInt(m.id) ? 'id' : !isNonNegInt(m.peakIndex) ? 'peakIndex' : null),
  setRegion: (m) => (!(m.peakIndex === null || isNonNegInt(m.peakIndex)) ? 'peakIndex' : !isNum(m.fromPpm) ? 'fromPpm'
    : !(isNum(m.toPpm) && m.toPpm !== m.fromPpm) ? 'toPpm' : null),
  cancel: () => null,
};

/**
 * Checks a raw message against a table of per-type field checks; the error names the type and the
 * field at fault. Own keys only: a type such as "valueOf" must not reach Object.prototype's functions.
 */
function parseWith<T>(table: Readonly<Record<string, (m: Obj) => string | null>>, raw: unknown): Parsed<T> {
  if (!isObj(raw) || !isStr(raw.type)) return { ok: false, error: 'message is not an object with a string "type"' };
  const check = Object.hasOwn(table, raw.type) ? table[raw.type] : undefined;
  if (!check) return { ok: false, error: `unknown message type "${raw.type}"` };
  const bad = check(raw);
  return bad ? { ok: false, error: `message "${raw.type}": field "${bad}" is missing or invalid` } : { ok: true, value: raw as unknown as T };
}

/** Validates a message from the webview. */
export function parseFromWebview(raw: unknown): Parsed<FromWebview> {
  return parseWith<FromWebview>(FROM_WEBVIEW, raw);
}

/** Every panel command once (the Record makes the compiler ask for a new one). */
const PANEL_COMMANDS: Readonly<Record<CommandMessage['command'], true>> = { nextPeak: true, previousPeak: true, measure: true, accept: true, label: true, removePick: true, zoomToPeak: true, resetZoom: true };

const TO_WEBVIEW: Record<ToWebview['type'], (m: Obj) => string | null> = {
  init: (m) => (!isSpectrumMeta(m.spectrum) ? 'spectrum' : !isViewSettings(m.settings) ? 'settings' : !(Array.isArray(m.peaks) && m.peaks.every(isPeakView)) ? 'peaks'
    : !isSidecarView(m.sidecar) ? 'sidecar' : !isStrList(m.knownLabels) ? 'knownLabels' : null),
  tile: (m) => (!isNonNegInt(m.inReplyTo) ? 'inReplyTo' : !isRegion(m.region) ? 'region' : !isPosInt(m.rows) ? 'rows' : !isPosInt(m.cols) ? 'cols' : !(m.data instanceof Float32Array) || m.data.length !== (m.rows as number) * (m.cols as number) ? 'data' : null),
  sidecar: (m) => (!isSidecarView(m.sidecar) ? 'sidecar' : null),
  measured: (m) => (!isNonNegInt(m.inReplyTo) ? 'inReplyTo' : !isMeasurementView(m.measurement) ? 'measurement' : null),
  analysed: (m) => (!isNonNegInt(m.inReplyTo) ? 'inReplyTo' : !isMultipletView(m.analysis) ? 'analysis' : null),
  progress: (m) => (!isStr(m.task) ? 'task' : !isNonNegInt(m.done) ? 'done' : !isNonNegInt(m.total) ? 'total' : null),
  error: (m) => (!isStr(m.message) ? 'message' : !(m.cancelled === undefined || m.cancelled === true) ? 'cancelled' : null),
  command: (m) => (!(isStr(m.command) && Object.hasOwn(PANEL_COMMANDS, m.command)) ? 'command' : null),
  settings: (m) => (!isViewSettings(m.settings) ? 'settings' : null),
  compare: (m) => (!(m.against === null || isStr(m.against)) ? 'against' : !(Array.isArray(m.marks) && m.marks.every(isReviewMark)) ? 'marks' : null),
};

/** Validates a message from the host (the webview checks what it receives too). */
export function parseToWebview(raw: unknown): Parsed<ToWebview> {
  return parseWith<ToWebview>(TO_WEBVIEW, raw);
}
