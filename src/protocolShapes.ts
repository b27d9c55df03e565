/**
 * Shape checks for the views inside host -> webview messages (src/protocol.ts): what the webview
 * reads from a message must be there with the right type before it reaches drawing code, so a
 * stale or damaged message is refused with the field named instead of failing later in a frame.
 * Pure; no DOM and no vscode, so the host, the webview and the tests share it.
 */
import type { AxisMeta, CosyCheckView, MeasurementView, MultipletView, PeakView, PickView, SidecarView, SpectrumMeta, TraceView, CouplingView } from './protocol';

type Obj = Record<string, unknown>;

export const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
export const isNum = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
export const isStr = (v: unknown): v is string => typeof v === 'string';
export const isStrList = (v: unknown): v is string[] => Array.isArray(v) && v.every(isStr);
const isInt = (v: unknown): v is number => typeof v === 'number' && Number.isInteger(v);
/** A number that may be NaN or infinite (an uncertainty that could not be estimated is still shown). */
const isAnyNum = (v: unknown): v is number => typeof v === 'number';
const isOptNum = (v: unknown): boolean => v === undefined || isNum(v);
const listOf = <T>(v: unknown, item: (x: unknown) => x is T): v is T[] => Array.isArray(v) && v.every(item);

const PEAK_KINDS: readonly unknown[] = ['cross', 'diagonal', 'multiplet'];

function isAxis(v: unknown): v is AxisMeta {
  return isObj(v) && isInt(v.points) && v.points > 0 && isNum(v.firstHz) && isNum(v.lastHz) && isNum(v.observeMhz) && v.observeMhz > 0;
}

export function isSpectrumMeta(v: unknown): v is SpectrumMeta {
  return isObj(v) && isStr(v.fileName) && isStr(v.title) && (v.dims === 1 || v.dims === 2) && isAxis(v.f2)
    && (v.dims === 2 ? isAxis(v.f1) : v.f1 === undefined) && isAnyNum(v.noise) && isNum(v.min) && isNum(v.max);
}

export function isPeakView(v: unknown): v is PeakView {
  return isObj(v) && isInt(v.index) && PEAK_KINDS.includes(v.kind) && isNum(v.f2Ppm) && isOptNum(v.f1Ppm)
    && isObj(v.extent) && isNum(v.extent.f2FromPpm) && isNum(v.extent.f2ToPpm) && isOptNum(v.extent.f1FromPpm) && isOptNum(v.extent.f1ToPpm)
    && (v.partner === null || isInt(v.partner));
}

function isPickView(v: unknown): v is PickView {
  return isObj(v) && isStr(v.id) && isNum(v.f2Ppm) && isOptNum(v.f1Ppm) && isStrList(v.label) && (v.kind === undefined || PEAK_KINDS.includes(v.kind))
    && isOptNum(v.fromPpm) && isOptNum(v.toPpm) && isOptNum(v.protons);
}

function isCouplingView(v: unknown): v is CouplingView {
  return isObj(v) && Array.isArray(v.atoms) && v.atoms.length === 2 && isStrList(v.atoms) && isNum(v.jHz) && isAnyNum(v.jSdHz)
    && isStr(v.method) && (v.dimension === 'F2' || v.dimension === 'F1') && isStrList(v.picks) && isStrList(v.flags);
}

export function isSidecarView(v: unknown): v is SidecarView {
  return isObj(v) && listOf(v.picks, isPickView) && listOf(v.couplings, isCouplingView) && (v.blocked === null || isStr(v.blocked));
}

function isTrace(v: unknown): v is TraceView {
  return isObj(v) && isNum(v.f1Ppm) && isNum(v.fromPpm) && isNum(v.toPpm)
    && v.data instanceof Float32Array && v.fitted instanceof Float32Array && v.residual instanceof Float32Array;
}

export function isMeasurementView(v: unknown): v is MeasurementView {
  return isObj(v) && isInt(v.peakIndex) && v.peakIndex >= 0 && isNum(v.jHz) && isAnyNum(v.jSdHz) && listOf(v.passiveHz, isAnyNum)
    && isAnyNum(v.linewidthHz) && (v.method === 'fit' || v.method === 'naive') && (v.dimension === 'F2' || v.dimension === 'F1')
    && isStrList(v.flags) && isStrList(v.notes) && listOf(v.traces, isTrace);
}

function isCosyCheck(v: unknown): v is CosyCheckView {
  return isObj(v) && isStr(v.partner) && isNum(v.cosyJHz) && isAnyNum(v.cosySdHz) && isNum(v.oneDJHz) && isAnyNum(v.oneDSdHz) && typeof v.agrees === 'boolean';
}

const isGroup = (v: unknown): boolean => isObj(v) && isNum(v.jHz) && isAnyNum(v.sdHz) && isInt(v.count) && v.count > 0;

function isFitted(v: unknown): boolean {
  return v === null || (isObj(v) && isNum(v.fromPpm) && isNum(v.toPpm) && v.data instanceof Float32Array);
}

export function isMultipletView(v: unknown): v is MultipletView {
  return isObj(v) && isInt(v.peakIndex) && v.peakIndex >= 0 && (v.pickId === null || isStr(v.pickId)) && isStrList(v.label)
    && isNum(v.centrePpm) && isNum(v.fromPpm) && isNum(v.toPpm) && typeof v.regionSet === 'boolean' && isAnyNum(v.integral)
    && (v.protons === null || isAnyNum(v.protons)) && isStr(v.reference) && isStr(v.multiplicity)
    && Array.isArray(v.couplings) && v.couplings.every(isGroup) && isStrList(v.flags) && isStrList(v.notes)
    && listOf(v.cosy, isCosyCheck) && isStrList(v.partners) && listOf(v.linesPpm, isNum) && isFitted(v.fitted);
}
