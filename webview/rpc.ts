/**
 * Request/reply over postMessage: each request gets a fresh `id`, the reply names it in
 * `inReplyTo`. Pure (the post function is passed in), so it is tested in Node.
 */
import type { AnalysedMessage, FromWebview, MeasuredMessage, TileMessage } from '../src/protocol';

/** The host cancelled the request (Esc, a cancel button): not a failure of the work itself. */
export class CancelledReply extends Error {
  override readonly name = 'CancelledReply';
}

export interface Pending<T> {
  readonly id: number;
  readonly promise: Promise<T>;
}

export class Requests<Reply> {
  private nextId = 1;
  private readonly waiting = new Map<number, { resolve: (r: Reply) => void; reject: (e: Error) => void }>();

  /** Sends `build(id)` through `post` and returns the id and a promise of the reply. */
  send(post: (message: FromWebview) => void, build: (id: number) => FromWebview): Pending<Reply> {
    const id = this.nextId++;
    const promise = new Promise<Reply>((resolve, reject) => this.waiting.set(id, { resolve, reject }));
    post(build(id));
    return { id, promise };
  }

  /** Settles the request a reply answers; false when nobody waits for it (late or duplicate). */
  resolve(inReplyTo: number, reply: Reply): boolean {
    const w = this.waiting.get(inReplyTo);
    if (!w) return false;
    this.waiting.delete(inReplyTo);
    w.resolve(reply);
    return true;
  }

  /** Settles a request with an error; `cancelled` makes it a CancelledReply. */
  reject(inReplyTo: number, message: string, cancelled = false): boolean {
    const w = this.waiting.get(inReplyTo);
    if (!w) return false;
    this.waiting.delete(inReplyTo);
    w.reject(cancelled ? new CancelledReply(message) : new Error(message));
    return true;
  }

  get pendingCount(): number {
    return this.waiting.size;
  }
}

/** What the panel uses to talk to the host: one id sequence for every kind of request. */
export interface Rpc {
  readonly post: (m: FromWebview) => void;
  readonly requests: Requests<TileMessage | MeasuredMessage | AnalysedMessage>;
}

/**
 * A message from the host that failed validation but names a request in `inReplyTo`: that request
 * is rejected with the reason, so the panel shows it instead of waiting for ever ("Measuring…", or
 * a tile that never comes and stops the plot loading). False when it answers no waiting request.
 */
export function settleInvalidReply<R>(requests: Requests<R>, raw: unknown, error: string): boolean {
  const id: unknown = typeof raw === 'object' && raw !== null ? Reflect.get(raw, 'inReplyTo') : undefined;
  return typeof id === 'number' && requests.reject(id, `the host sent a reply the panel cannot read: ${error}`);
}
