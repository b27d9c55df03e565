import { describe, expect, it } from 'vitest';
import type { FromWebview } from '../../src/protocol';
import { CancelledReply, Requests, settleInvalidReply } from '../../webview/rpc';

describe('Requests', () => {
  it('numbers requests and settles each by its inReplyTo', async () => {
    const sent: FromWebview[] = [];
    const r = new Requests<string>();
    const a = r.send((m) => sent.push(m), (id) => ({ type: 'measure', id, peakIndex: 1, method: 'fit', dimension: 'F2' }));
    const b = r.send((m) => sent.push(m), (id) => ({ type: 'measure', id, peakIndex: 2, method: 'fit', dimension: 'F2' }));
    expect(sent.map((m) => (m.type === 'measure' ? m.id : -1))).toEqual([a.id, b.id]);
    expect(a.id).not.toBe(b.id);
    expect(r.resolve(b.id, 'second')).toBe(true);
    expect(r.reject(a.id, 'no peak')).toBe(true);
    await expect(b.promise).resolves.toBe('second');
    await expect(a.promise).rejects.toThrow('no peak');
    expect(r.pendingCount).toBe(0);
  });
  it('ignores late or duplicate replies', () => {
    const r = new Requests<string>();
    const a = r.send(() => undefined, (id) => ({ type: 'cancel', id } as unknown as FromWebview));
    expect(r.resolve(a.id, 'x')).toBe(true);
    expect(r.resolve(a.id, 'y')).toBe(false);
    expect(r.resolve(999, 'z')).toBe(false);
  });
  it('rejects a cancelled request with CancelledReply, so the panel can tell it from a failure', async () => {
    const r = new Requests<string>();
    const a = r.send(() => undefined, (id) => ({ type: 'measure', id, peakIndex: 1, method: 'fit', dimension: 'F2' }));
    const b = r.send(() => undefined, (id) => ({ type: 'measure', id, peakIndex: 2, method: 'fit', dimension: 'F2' }));
    expect(r.reject(a.id, 'measurement cancelled', true)).toBe(true);
    expect(r.reject(b.id, 'no peak')).toBe(true);
    await expect(a.promise).rejects.toBeInstanceOf(CancelledReply);
    await expect(b.promise).rejects.not.toBeInstanceOf(CancelledReply);
  });
  it('settles the request an invalid reply answers, with the validation error, instead of waiting for ever', async () => {
    const r = new Requests<string>();
    const a = r.send(() => undefined, (id) => ({ type: 'measure', id, peakIndex: 1, method: 'fit', dimension: 'F2' }));
    expect(settleInvalidReply(r, { type: 'measured', inReplyTo: a.id, measurement: {} }, 'field "measurement" is missing or invalid')).toBe(true);
    await expect(a.promise).rejects.toThrow('the host sent a reply the panel cannot read: field "measurement" is missing or invalid');
    expect(settleInvalidReply(r, { type: 'sidecar' }, 'x')).toBe(false);
    expect(settleInvalidReply(r, 'junk', 'x')).toBe(false);
  });
});
