/**
 * The compare overlay follows the sidecar: edits while it is shown recompute the marks after a
 * pause (one recomputation for a burst of edits), and a restored panel gets it back. A fake clock
 * stands in for setTimeout, so nothing here waits.
 */
import { describe, expect, it } from 'vitest';
import { formatSidecar, type Sidecar } from '../../../src/core/sidecar';
import { CompareOverlay } from '../../../src/extension/review/compareOverlay';
import { parseToWebview, type CompareMessage } from '../../../src/protocol';

const base: Sidecar = {
  schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: 'a'.repeat(64) },
  picks: [{ id: 'p-1', f2Ppm: 4.12, f1Ppm: 2.34, label: ['H-3', 'H-4a'] }],
  couplings: [],
};
const withPick = (id: string, f2Ppm: number): Sidecar => ({ ...base, picks: [...base.picks, { id, f2Ppm, f1Ppm: 3, label: [] }] });

function harness(initial: string | null) {
  const h = {
    text: initial,
    posted: [] as CompareMessage[],
    timers: new Map<number, () => void>(),
    nextTimer: 1,
    delays: [] as number[],
  };
  const overlay = new CompareOverlay('cosy.jdx.couplet.yaml', () => h.text, (m) => void h.posted.push(m), (f, ms) => {
    const id = h.nextTimer++;
    h.timers.set(id, f);
    h.delays.push(ms);
    return () => void h.timers.delete(id);
  });
  /** Runs every pending timer, as if the pause had passed. */
  const elapse = (): void => {
    const due = [...h.timers.values()];
    h.timers.clear();
    for (const f of due) f();
  };
  return { h, overlay, elapse };
}

describe('CompareOverlay', () => {
  it('shows the changes since a revision, and is inactive until shown and after clearing', () => {
    const { h, overlay } = harness(formatSidecar(withPick('p-2', 5)));
    expect(overlay.active).toBe(false);
    expect(overlay.show('HEAD', formatSidecar(base))).toBeNull();
    expect(overlay.active).toBe(true);
    expect(h.posted.at(-1)).toMatchObject({ type: 'compare', against: 'HEAD', marks: [{ kind: 'added', f2Ppm: 5 }] });
    overlay.clear();
    expect(overlay.active).toBe(false);
    expect(h.posted.at(-1)).toEqual({ type: 'compare', against: null, marks: [] });
  });

  it('refreshes after the sidecar is edited while shown, once for a burst of edits', () => {
    const { h, overlay, elapse } = harness(formatSidecar(base));
    overlay.show('HEAD', formatSidecar(base));
    expect(h.posted.at(-1)?.marks).toEqual([]);
    h.text = formatSidecar(withPick('p-2', 5));
    overlay.sidecarChanged();
    h.text = formatSidecar(withPick('p-3', 6));
    overlay.sidecarChanged();
    expect(h.posted).toHaveLength(1); // nothing yet: debounced
    expect(h.timers.size).toBe(1);
    elapse();
    expect(h.posted).toHaveLength(2);
    const m = h.posted[1];
    expect(m?.marks.map((k) => [k.kind, k.f2Ppm])).toEqual([['added', 6]]);
    expect(m && parseToWebview(m).ok).toBe(true);
    expect(h.delays.every((d) => d > 0 && d <= 1000)).toBe(true);
  });

  it('does nothing on edits when no overlay is shown, nor after it was cleared', () => {
    const { h, overlay, elapse } = harness(formatSidecar(base));
    overlay.sidecarChanged();
    overlay.show('main', formatSidecar(base));
    h.text = formatSidecar(withPick('p-2', 5));
    overlay.sidecarChanged();
    overlay.clear();
    elapse();
    expect(h.posted.map((m) => m.against)).toEqual(['main', null]);
  });

  it('keeps the last marks, saying they are not current, while the sidecar cannot be read', () => {
    const { h, overlay, elapse } = harness(formatSidecar(withPick('p-2', 5)));
    overlay.show('HEAD', formatSidecar(base));
    h.text = '<<<<<<< HEAD\npicks: [\n';
    overlay.sidecarChanged();
    elapse();
    const m = h.posted.at(-1);
    expect(m?.against).toContain('HEAD');
    expect(m?.against).toContain('cannot be read');
    expect(m?.marks).toEqual(h.posted[0]?.marks);
  });

  it('counts a sidecar emptied (the first pick undone) as every pick removed', () => {
    const { h, overlay, elapse } = harness(formatSidecar(base));
    overlay.show('HEAD', formatSidecar(base));
    h.text = '';
    overlay.sidecarChanged();
    elapse();
    expect(h.posted.at(-1)?.marks.map((k) => k.kind)).toEqual(['removed']);
  });

  it('names the file when the revision holds no sidecar yet, and refuses an unreadable old text', () => {
    const { h, overlay } = harness(formatSidecar(base));
    expect(overlay.show('v1', null)).toBeNull();
    expect(h.posted.at(-1)?.against).toBe('v1 (file not there yet)');
    expect(overlay.show('v0', '<<<<<<< ours\n')).toMatch(/cosy\.jdx\.couplet\.yaml at v0 cannot be read/);
    const none = harness(null);
    expect(none.overlay.show('v1', null)).toBeNull();
    expect(none.h.posted.at(-1)?.marks).toEqual([]);
  });

  it('sends the overlay again when the panel was restored (its webview reloaded), and stops on dispose', () => {
    const { h, overlay, elapse } = harness(formatSidecar(withPick('p-2', 5)));
    overlay.restored();
    expect(h.posted).toEqual([]);
    overlay.show('HEAD', formatSidecar(base));
    overlay.restored();
    expect(h.posted).toHaveLength(2);
    expect(h.posted[1]).toEqual(h.posted[0]);
    overlay.sidecarChanged();
    overlay.dispose();
    elapse();
    expect(h.timers.size).toBe(0);
    expect(h.posted).toHaveLength(2);
    // The panel closed while the revision list was open: its webview is gone, nothing is posted.
    expect(overlay.show('main', formatSidecar(base))).toBeNull();
    overlay.clear();
    expect(h.posted).toHaveLength(2);
  });
});
