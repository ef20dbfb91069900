import crypto from 'node:crypto';
import { API_VERSION, newId, now, type FakeDelivery, type FakeEvent, type Obj } from './state';

/**
 * The fake's webhook events: each POSTed to the webhook URL signed like the real service
 * (`Stripe-Signature: t=…,v1=HMAC-SHA256(secret, "t.payload")`), first attempts one after another in the order
 * the events happened, failed ones retried after `retryDelays` beside them.
 */
export class Webhooks {
  readonly events: FakeEvent[] = [];
  readonly deliveries: FakeDelivery[] = [];
  private pending = 0;
  private idleWaiters: (() => void)[] = [];
  private readonly timers = new Set<NodeJS.Timeout>();
  private closed = false;
  private chain: Promise<unknown> = Promise.resolve();

  constructor(
    private readonly secret: string,
    private readonly retryDelays: number[],
    public url: string | null,
  ) {}

  private settle(): void {
    if (this.pending === 0) {
      const w = this.idleWaiters;
      this.idleWaiters = [];
      for (const f of w) f();
    }
  }

  private sign(payload: string): string {
    const t = now();
    const v1 = crypto.createHmac('sha256', this.secret).update(`${t}.${payload}`, 'utf8').digest('hex');
    return `t=${t},v1=${v1}`;
  }

  /** One delivery attempt; schedules the next on failure. Resolves after the attempt. */
  private async deliver(ev: FakeEvent, attempt: number): Promise<boolean> {
    if (this.closed || !this.url) return false;
    const payload = JSON.stringify(ev, null, 2);
    let status: number | null = null;
    let error: string | null = null;
    try {
      const res = await fetch(this.url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'Stripe-Signature': this.sign(payload),
          'User-Agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
        },
        body: payload,
        signal: AbortSignal.timeout(10000),
      });
      status = res.status;
      await res.arrayBuffer().catch(() => undefined);
    } catch (err) {
      error = err instanceof Error ? err.message : String(err);
    }
    this.deliveries.push({ eventId: ev.id, type: ev.type, attempt, status, error, at: new Date().toISOString() });
    const ok = status !== null && status >= 200 && status < 300;
    if (ok) ev.pending_webhooks = 0;
    if (!ok && attempt <= this.retryDelays.length && !this.closed) {
      this.pending += 1;
      const timer = setTimeout(
        () => {
          this.timers.delete(timer);
          void this.deliver(ev, attempt + 1).finally(() => {
            this.pending -= 1;
            this.settle();
          });
        },
        this.retryDelays[attempt - 1],
      );
      this.timers.add(timer);
    }
    return ok;
  }

  /** Records an event about `object` and queues its delivery; resolves with whether the first attempt was answered 2xx. */
  emit(type: string, object: Obj): Promise<boolean> {
    const ev: FakeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: now(),
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: this.url ? 1 : 0,
      request: { id: null, idempotency_key: null },
      type,
    };
    this.events.push(ev);
    this.pending += 1;
    const done = this.chain.then(() => this.deliver(ev, 1));
    this.chain = done.catch(() => false);
    void done.finally(() => {
      this.pending -= 1;
      this.settle();
    });
    return done;
  }

  /** Resolves when no delivery is pending or waiting for a retry. */
  idle(): Promise<void> {
    return this.pending === 0 ? Promise.resolve() : new Promise<void>((r) => this.idleWaiters.push(r));
  }

  /** Stops delivering: pending retries are dropped. */
  close(): void {
    this.closed = true;
    for (const t of this.timers) clearTimeout(t);
    this.timers.clear();
    this.pending = 0;
    this.settle();
  }
}
