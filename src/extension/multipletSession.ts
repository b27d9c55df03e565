/**
 * The 1D side of a panel (PanelSession delegates to it): the analysis of the selected multiplet,
 * run in the worker with stale requests cancelled, and the region and integral-reference edits.
 * The webview's `analyse` request also tells the host which multiplet the palette commands act on.
 */
import type { Multiplet1D } from '../core/peaks';
import { integrateRegion, type KnownPartner, type MultipletAnalysis, type MultipletOptions } from '../core/report/multiplet';
import { autoRegion } from '../core/report/multipletRegion';
import type { Pick } from '../core/sidecar';
import type { Spectrum1D } from '../core/spectrum/spectrum';
import type { ToWebview } from '../protocol';
import { CancelledError } from './fitClient';
import { partnersFor, type SidecarSource } from './multipletPartners';
import { pickOfMultiplet, picksOf, referenceText, regionText, type Region } from './multipletRegion';
import { multipletView, type ViewContext } from './multipletView';
import type { SidecarStore } from './panelSession';
import type { SpectrumModel } from './spectrumModel';

/** The worker's 1D analysis (FitClient), or an in-process one in tests. */
export interface Analyser {
  analyse(fromPpm: number, toPpm: number, options: MultipletOptions): Promise<MultipletAnalysis>;
  /** Stops the analysis in progress (it rejects with CancelledError). */
  cancel(): void;
}

export interface MultipletPorts {
  readonly analyser: Analyser;
  /** The other sidecars in the spectrum's folder (the compound's DQF-COSY sidecar). */
  folderSidecars(): Promise<SidecarSource[]>;
  post(message: ToWebview): void;
  /** PanelSession's edit: one undoable change, or a notification saying why not. */
  edit(label: string, change: (text: string | null) => string): Promise<boolean>;
  refuse(message: string): false;
}

interface Inputs {
  readonly multiplet: Multiplet1D;
  readonly pick: Pick | undefined;
  readonly region: Region;
  readonly options: MultipletOptions;
  readonly context: ViewContext;
}

const describe = (e: unknown): string => (e instanceof Error ? e.message : String(e));

export class MultipletSession {
  /** The multiplet the panel selected last (what the palette commands act on). */
  selected: number | null = null;
  private latest = 0;
  private running: { key: string; promise: Promise<MultipletAnalysis> } | null = null;
  /** Analyses by their inputs: re-selecting a multiplet, or a label edit that changes nothing, costs nothing. */
  private readonly done = new Map<string, MultipletAnalysis>();

  constructor(private readonly model: SpectrumModel, private readonly store: SidecarStore, private readonly ports: MultipletPorts) {}

  private get spectrum(): Spectrum1D {
    if (this.model.spectrum.dims !== 1) throw new Error(`${this.model.fileName} is a 2D spectrum; multiplet analysis is for 1D ¹H spectra`);
    return this.model.spectrum;
  }

  /** The automatic region of multiplet i: the same as `couplet report` and `couplet measure` use (core autoRegion). */
  private autoRegion(i: number): Region {
    const [fromPpm, toPpm] = autoRegion(this.model.multiplets, i, this.spectrum.axis.observeMhz);
    return { fromPpm, toPpm };
  }

  /** Region of a pick: its own, else the automatic region of the multiplet it sits on. */
  private regionOfPick(p: Pick): Region | null {
    if (p.fromPpm !== undefined && p.toPpm !== undefined) return { fromPpm: p.fromPpm, toPpm: p.toPpm };
    const i = this.model.multiplets.findIndex((k) => pickOfMultiplet([p], k) !== undefined);
    return i >= 0 ? this.autoRegion(i) : null;
  }

  /** The sidecar's integral reference with its integral; null without one (or when its region cannot be integrated). */
  private reference(picks: readonly Pick[]): { pick: Pick; protons: number; integral: number } | null {
    const pick = picks.find((p) => p.protons !== undefined);
    const region = pick && this.regionOfPick(pick);
    if (!pick || pick.protons === undefined || !region) return null;
    try {
      return { pick, protons: pick.protons, integral: integrateRegion(this.spectrum, region.fromPpm, region.toPpm) };
    } catch {
      return null;
    }
  }

  /** Everything the analysis of one multiplet depends on. */
  async inputs(index: number): Promise<Inputs | string> {
    const multiplet = this.model.multiplets[index];
    if (!multiplet) return `${this.model.fileName} has no multiplet ${index} (${this.model.multiplets.length} found)`;
    const picks = picksOf(this.store.text(), this.store.fileName);
    const pick = pickOfMultiplet(picks, multiplet);
    const own = pick?.fromPpm !== undefined && pick.toPpm !== undefined;
    const region = own && pick ? { fromPpm: pick.fromPpm ?? 0, toPpm: pick.toPpm ?? 0 } : this.autoRegion(index);
    const atom = pick?.label.length === 1 ? pick.label[0] : undefined;
    let partners: KnownPartner[] = [];
    if (atom !== undefined) partners = partnersFor(atom, await this.ports.folderSidecars().catch(() => []));
    const ref = this.reference(picks);
    const options: MultipletOptions = { partners, ...(ref && ref.integral > 0 && { reference: { integral: ref.integral, protons: ref.protons } }) };
    const context: ViewContext = {
      peakIndex: index, pickId: pick?.id ?? null, label: pick?.label ?? [], regionSet: own, axis: this.spectrum.axis,
      reference: ref && { pickId: ref.pick.id, label: ref.pick.label, protons: ref.protons }, partners: partners.map((p) => p.label),
    };
    return { multiplet, pick, region, options, context };
  }

  /** Answers an `analyse` request: `analysed`, or `error` (cancelled when a newer request replaced it). */
  async analyse(id: number, index: number): Promise<void> {
    this.selected = index;
    const mine = ++this.latest;
    try {
      const inp = await this.inputs(index);
      if (typeof inp === 'string') return this.ports.post({ type: 'error', inReplyTo: id, message: inp });
      const a = await this.run(inp.region, inp.options);
      if (mine !== this.latest) throw new CancelledError('a newer analysis replaced this one');
      this.ports.post({ type: 'analysed', inReplyTo: id, analysis: multipletView(a, inp.context) });
    } catch (e) {
      const cancelled = e instanceof CancelledError;
      this.ports.post({ type: 'error', inReplyTo: id, message: cancelled ? 'analysis cancelled' : `multiplet analysis failed: ${describe(e)}`, ...(cancelled && { cancelled: true as const }) });
    }
  }

  /** The analysis for these inputs: cached, the one already running for them, or a new one (cancelling a stale one). */
  private run(region: Region, options: MultipletOptions): Promise<MultipletAnalysis> {
    const key = JSON.stringify([region, options]);
    const known = this.done.get(key);
    if (known) return Promise.resolve(known);
    if (this.running?.key === key) return this.running.promise;
    if (this.running) this.ports.analyser.cancel();
    const promise = this.ports.analyser.analyse(region.fromPpm, region.toPpm, options);
    const entry = { key, promise };
    this.running = entry;
    const clear = (): void => {
      if (this.running === entry) this.running = null;
    };
    promise.then((a) => {
      this.done.set(key, a);
      clear();
    }, clear);
    return promise;
  }

  /** Sets a region (Shift+drag or the palette) on the multiplet's pick (a new pick when it has none); a null region clears it. */
  async setRegion(index: number | null, region: Region | null): Promise<boolean> {
    const m = index === null ? undefined : this.model.multiplets[index];
    if (index !== null && !m) return this.ports.refuse(`${this.model.fileName} has no multiplet ${index}`);
    // The panel selects automatic multiplets only: a pick in a region without one could never be selected or analysed.
    if (!m && region) {
      return this.ports.refuse(`no multiplet was picked between ${region.fromPpm.toFixed(3)} and ${region.toPpm.toFixed(3)} ppm ` +
        '(nothing above the picking threshold there); a region is set on a picked multiplet');
    }
    const pick = m ? pickOfMultiplet(picksOf(this.store.text(), this.store.fileName), m) : undefined;
    const f2Ppm = m?.ppm ?? (region ? (region.fromPpm + region.toPpm) / 2 : NaN);
    return this.ports.edit(region ? 'Set multiplet region' : 'Clear multiplet region', (t) => regionText(t, this.store.fileName, {
      ...(pick && { pickId: pick.id }), f2Ppm, dataFileName: this.model.fileName, sha256: this.model.sha256,
    }, region).text);
  }

  /** Makes the selected multiplet's pick the integral reference (null clears the sidecar's reference). */
  async setReference(protons: number | null): Promise<boolean> {
    const picks = picksOf(this.store.text(), this.store.fileName);
    if (protons === null) {
      const ref = picks.find((p) => p.protons !== undefined);
      if (!ref) return this.ports.refuse(`${this.store.fileName} has no integral reference to clear`);
      return this.ports.edit('Clear integral reference', (t) => referenceText(t, this.store.fileName, ref.id, null));
    }
    const m = this.selected === null ? undefined : this.model.multiplets[this.selected];
    if (!m) return this.ports.refuse('select a multiplet first (click it, or N / P)');
    const pick = pickOfMultiplet(picks, m);
    if (!pick) return this.ports.refuse(`multiplet at ${m.ppm.toFixed(4)} ppm has no pick yet; pick it first (A), then set the reference`);
    return this.ports.edit('Set integral reference', (t) => referenceText(t, this.store.fileName, pick.id, protons));
  }

  /** The selected multiplet's region as the input box offers it ("3.8480 3.7930"), or null without a selection. */
  async currentRegion(): Promise<Region | null> {
    if (this.selected === null) return null;
    const inp = await this.inputs(this.selected);
    return typeof inp === 'string' ? null : inp.region;
  }
}
