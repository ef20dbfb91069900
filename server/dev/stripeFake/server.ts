import crypto from 'node:crypto';
import fs from 'node:fs';
import nodePath from 'node:path';
import http, { type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { parseForm, str, strMap, type FormValue } from './form';
import { cardPage, challengePage, closedPage } from './pages';

/**
 * A small local stand-in for the few card-payment API calls Lanewright makes, speaking the real protocol:
 * form-encoded requests under /v1 with a bearer secret key, JSON objects shaped like the real ones,
 * errors as `{error: {type, code, message, param}}`, idempotency keys honoured; a hosted card page and an
 * authentication challenge; webhook events POSTed to the configured URL, signed like the real service
 * (`Stripe-Signature: t=…,v1=HMAC-SHA256(secret, "t.payload")`) and retried until answered 2xx.
 *
 * Test cards: 4242 4242 4242 4242 succeeds; 4000 0000 0000 0002 is declined; 4000 0025 0000 3155
 * requires authentication (Approve → succeeds, Fail → payment fails).
 */

type Obj = Record<string, unknown>;

export interface FakeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: Obj };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface FakeDelivery {
  eventId: string;
  type: string;
  attempt: number;
  status: number | null;
  error: string | null;
  at: string;
}

export interface StripeFakeOptions {
  /** 0 = a free port. */
  port?: number;
  host?: string;
  /** The signing secret the receiver verifies with (whsec_…). */
  webhookSecret: string;
  /** The one secret key the fake accepts (sk_test_…); unset = any sk_test_ key. */
  apiKey?: string;
  /** Where events are POSTed; null keeps them (readable in `events`) without delivering. */
  webhookUrl?: string | null;
  /** Delays between delivery attempts of one event (the real service retries for days; here seconds). */
  retryDelaysMs?: number[];
  /** Max wait for the first delivery of a completion before the browser is redirected (ms). */
  redirectWaitMs?: number;
  /** Keeps sessions, payments and refunds in this JSON file across restarts (development). */
  stateFile?: string;
}

export interface StripeFake {
  url: string;
  port: number;
  host: string;
  setWebhookUrl(url: string | null): void;
  readonly events: FakeEvent[];
  readonly deliveries: FakeDelivery[];
  /** Resolves when no delivery is pending or waiting for a retry. */
  idle(): Promise<void>;
  close(): Promise<void>;
}

const API_VERSION = '2026-10-28.endive';
const CARD_OK = ['4242424242424242', '5555555555554444'];
const CARD_DECLINED = '4000000000000002';
const CARD_3DS = '4000002500003155';

class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly body: { type: string; code?: string; message: string; param?: string; decline_code?: string },
  ) {
    super(body.message);
  }
}

const now = () => Math.floor(Date.now() / 1000);
const newId = (prefix: string) => `${prefix}_test_${crypto.randomBytes(12).toString('base64url').replace(/[-_]/g, 'x')}`;

function luhn(num: string): boolean {
  let sum = 0;
  for (let i = 0; i < num.length; i++) {
    let d = Number(num[num.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return num.length >= 12 && sum % 10 === 0;
}

function readBody(req: IncomingMessage, limit = 256 * 1024): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (c: Buffer) => {
      size += c.length;
      if (size > limit) {
        reject(new ApiError(413, { type: 'invalid_request_error', message: 'Request body too large' }));
        req.destroy();
        return;
      }
      chunks.push(c);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

function intParam(v: FormValue | undefined, param: string, required = true): number | undefined {
  const s = str(v);
  if (s === undefined) {
    if (required) throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_missing', message: `Missing required param: ${param}.`, param });
    return undefined;
  }
  if (!/^\d+$/.test(s)) throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_invalid_integer', message: `Invalid integer: ${s}`, param });
  return Number(s);
}

/** Starts the fake on loopback; resolves once it listens. */
export async function startStripeFake(opts: StripeFakeOptions): Promise<StripeFake> {
  const host = opts.host ?? '127.0.0.1';
  const retryDelays = opts.retryDelaysMs ?? [500, 2000, 5000, 15000, 60000];
  const redirectWaitMs = opts.redirectWaitMs ?? 5000;
  let webhookUrl = opts.webhookUrl ?? null;
  let base = '';

  const sessions = new Map<string, Obj>();
  const intents = new Map<string, Obj>();
  const charges = new Map<string, Obj>();
  const refunds = new Map<string, Obj>();
  const sessionExtras = new Map<string, { productName: string; intentMetadata: Record<string, string>; description: string | null }>();
  const stores = { sessions, intents, charges, refunds, sessionExtras } as const;

  function loadState(): void {
    if (!opts.stateFile || !fs.existsSync(opts.stateFile)) return;
    try {
      const saved = JSON.parse(fs.readFileSync(opts.stateFile, 'utf8')) as Record<keyof typeof stores, [string, never][]>;
      for (const [name, map] of Object.entries(stores)) for (const [k, v] of saved[name as keyof typeof stores] ?? []) (map as Map<string, unknown>).set(k, v);
    } catch {
      // An unreadable state file starts the fake empty.
    }
  }
  function saveState(): void {
    if (!opts.stateFile) return;
    const out = Object.fromEntries(Object.entries(stores).map(([name, map]) => [name, [...(map as Map<string, unknown>).entries()]]));
    fs.mkdirSync(nodePath.dirname(opts.stateFile), { recursive: true });
    fs.writeFileSync(`${opts.stateFile}.tmp`, JSON.stringify(out));
    fs.renameSync(`${opts.stateFile}.tmp`, opts.stateFile);
  }
  loadState();
  const idempotent = new Map<string, { status: number; body: string }>();
  const events: FakeEvent[] = [];
  const deliveries: FakeDelivery[] = [];
  let pending = 0;
  let idleWaiters: (() => void)[] = [];
  const timers = new Set<NodeJS.Timeout>();
  let closed = false;

  const settle = () => {
    if (pending === 0) {
      const w = idleWaiters;
      idleWaiters = [];
      for (const f of w) f();
    }
  };

  function sign(payload: string): string {
    const t = now();
    const v1 = crypto.createHmac('sha256', opts.webhookSecret).update(`${t}.${payload}`, 'utf8').digest('hex');
    return `t=${t},v1=${v1}`;
  }

  /** One delivery attempt; schedules the next on failure. Resolves after the attempt. */
  async function deliver(ev: FakeEvent, attempt: number): Promise<boolean> {
    if (closed || !webhookUrl) return false;
    const payload = JSON.stringify(ev, null, 2);
    let status: number | null = null;
    let error: string | null = null;
    try {
      const res = await fetch(webhookUrl, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json; charset=utf-8', 'Stripe-Signature': sign(payload), 'User-Agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)' },
        body: payload,
        signal: AbortSignal.timeout(10000),
      });
      status = res.status;
      await res.arrayBuffer().catch(() => undefined);
    } catch (err) {
      error = err instanceof Error ? err.message : String(err);
    }
    deliveries.push({ eventId: ev.id, type: ev.type, attempt, status, error, at: new Date().toISOString() });
    const ok = status !== null && status >= 200 && status < 300;
    if (ok) ev.pending_webhooks = 0;
    if (!ok && attempt <= retryDelays.length && !closed) {
      pending += 1;
      const timer = setTimeout(() => {
        timers.delete(timer);
        void deliver(ev, attempt + 1).finally(() => {
          pending -= 1;
          settle();
        });
      }, retryDelays[attempt - 1]);
      timers.add(timer);
    }
    return ok;
  }

  // Events are delivered one after another in the order they happened (first attempts); retries run beside.
  let chain: Promise<unknown> = Promise.resolve();
  function emit(type: string, object: Obj): Promise<boolean> {
    const ev: FakeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: now(),
      data: { object: structuredClone(object) },
      livemode: false,
      pending_webhooks: webhookUrl ? 1 : 0,
      request: { id: null, idempotency_key: null },
      type,
    };
    events.push(ev);
    pending += 1;
    const done = chain.then(() => deliver(ev, 1));
    chain = done.catch(() => false);
    void done.finally(() => {
      pending -= 1;
      settle();
    });
    return done;
  }

  function sessionOr404(id: string): Obj {
    const s = sessions.get(id);
    if (!s) throw new ApiError(404, { type: 'invalid_request_error', code: 'resource_missing', message: `No such checkout.session: '${id}'`, param: 'id' });
    return s;
  }

  // ---- the API ----------------------------------------------------------------------------------------

  function createSession(p: Record<string, FormValue>): Obj {
    if (str(p.mode) !== 'payment') throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_invalid', message: 'Only mode=payment is supported here.', param: 'mode' });
    const successUrl = str(p.success_url);
    if (!successUrl) throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_missing', message: 'Missing required param: success_url.', param: 'success_url' });
    const items = Array.isArray(p.line_items) ? p.line_items : [];
    if (!items.length) throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_missing', message: 'Missing required param: line_items.', param: 'line_items' });
    let amount = 0;
    let currency: string | null = null;
    const names: string[] = [];
    items.forEach((raw, i) => {
      const it = (raw && typeof raw === 'object' && !Array.isArray(raw) ? raw : {}) as Record<string, FormValue>;
      const pd = (it.price_data && typeof it.price_data === 'object' && !Array.isArray(it.price_data) ? it.price_data : {}) as Record<string, FormValue>;
      const cur = str(pd.currency);
      if (!cur) throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_missing', message: 'Missing required param: line_items[0][price_data][currency].', param: `line_items[${i}][price_data][currency]` });
      if (currency && cur !== currency) throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_invalid', message: 'All line items must share a currency.', param: `line_items[${i}][price_data][currency]` });
      currency = cur.toLowerCase();
      const unit = intParam(pd.unit_amount, `line_items[${i}][price_data][unit_amount]`)!;
      const qty = intParam(it.quantity, `line_items[${i}][quantity]`)!;
      const product = (pd.product_data && typeof pd.product_data === 'object' && !Array.isArray(pd.product_data) ? pd.product_data : {}) as Record<string, FormValue>;
      names.push(str(product.name) ?? 'Item');
      amount += unit * qty;
    });
    if (amount < 50) throw new ApiError(400, { type: 'invalid_request_error', code: 'amount_too_small', message: 'The Checkout Session\'s total amount due must add up to at least $0.50 usd', param: 'line_items' });
    const pid = (p.payment_intent_data && typeof p.payment_intent_data === 'object' && !Array.isArray(p.payment_intent_data) ? p.payment_intent_data : {}) as Record<string, FormValue>;
    const id = newId('cs');
    const created = now();
    const s: Obj = {
      id,
      object: 'checkout.session',
      amount_subtotal: amount,
      amount_total: amount,
      cancel_url: str(p.cancel_url) ?? null,
      client_reference_id: str(p.client_reference_id) ?? null,
      created,
      currency,
      customer_email: str(p.customer_email) ?? null,
      expires_at: intParam(p.expires_at, 'expires_at', false) ?? created + 24 * 3600,
      livemode: false,
      metadata: strMap(p.metadata),
      mode: 'payment',
      payment_intent: null,
      payment_status: 'unpaid',
      status: 'open',
      success_url: successUrl,
      url: `${base}/pay/${id}`,
      // Not part of the real object: what the hosted page shows and what the intent carries.
    };
    sessions.set(id, s);
    sessionExtras.set(id, { productName: names.join(', '), intentMetadata: strMap(pid.metadata), description: str(pid.description) ?? null });
    return s;
  }

  function expireSession(id: string): Obj {
    const s = sessionOr404(id);
    if (s.status !== 'open') throw new ApiError(400, { type: 'invalid_request_error', code: 'checkout_session_not_open', message: `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${String(s.status)}".` });
    s.status = 'expired';
    s.url = null;
    void emit('checkout.session.expired', s);
    return s;
  }

  function createRefund(p: Record<string, FormValue>): Obj {
    let charge: Obj | undefined;
    const piId = str(p.payment_intent);
    const chId = str(p.charge);
    if (piId) {
      const pi = intents.get(piId);
      if (!pi) throw new ApiError(404, { type: 'invalid_request_error', code: 'resource_missing', message: `No such payment_intent: '${piId}'`, param: 'payment_intent' });
      if (!pi.latest_charge || pi.status !== 'succeeded')
        throw new ApiError(400, { type: 'invalid_request_error', code: 'charge_not_refundable', message: 'This PaymentIntent does not have a successful charge to refund.', param: 'payment_intent' });
      charge = charges.get(String(pi.latest_charge));
    } else if (chId) {
      charge = charges.get(chId);
      if (!charge) throw new ApiError(404, { type: 'invalid_request_error', code: 'resource_missing', message: `No such charge: '${chId}'`, param: 'charge' });
    } else {
      throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_missing', message: 'One of the following params should be provided for this request: payment_intent or charge.' });
    }
    const c = charge!;
    const left = Number(c.amount) - Number(c.amount_refunded);
    if (left <= 0) throw new ApiError(400, { type: 'invalid_request_error', code: 'charge_already_refunded', message: `Charge ${String(c.id)} has already been refunded.` });
    const amount = intParam(p.amount, 'amount', false) ?? left;
    if (amount > left || amount <= 0) throw new ApiError(400, { type: 'invalid_request_error', code: 'amount_too_large', message: `Refund amount (${amount}) is greater than unrefunded amount on charge (${left})`, param: 'amount' });
    const r: Obj = {
      id: newId('re'),
      object: 'refund',
      amount,
      charge: c.id,
      created: now(),
      currency: c.currency,
      metadata: strMap(p.metadata),
      payment_intent: c.payment_intent,
      reason: str(p.reason) ?? null,
      status: 'succeeded',
    };
    refunds.set(String(r.id), r);
    c.amount_refunded = Number(c.amount_refunded) + amount;
    c.refunded = c.amount_refunded === c.amount;
    void emit('refund.created', r);
    void emit('charge.refunded', c);
    return r;
  }

  async function api(req: IncomingMessage, res: ServerResponse, path: string): Promise<void> {
    const auth = req.headers.authorization ?? '';
    const key = /^Bearer (sk_test_\S+)$/.exec(auth)?.[1];
    if (!key || (opts.apiKey !== undefined && !crypto.timingSafeEqual(crypto.createHash('sha256').update(key).digest(), crypto.createHash('sha256').update(opts.apiKey).digest()))) {
      throw new ApiError(401, {
        type: 'invalid_request_error',
        message: auth ? 'Invalid API Key provided (test mode keys start with sk_test_).' : 'You did not provide an API key. Provide it in the Authorization header (Authorization: Bearer YOUR_SECRET_KEY).',
      });
    }
    const method = req.method ?? 'GET';
    const raw = method === 'POST' ? await readBody(req) : '';
    const idem = method === 'POST' ? req.headers['idempotency-key'] : undefined;
    const idemKey = typeof idem === 'string' ? `${key}:${path}:${idem}` : null;
    if (idemKey && idempotent.has(idemKey)) {
      const hit = idempotent.get(idemKey)!;
      res.writeHead(hit.status, { 'Content-Type': 'application/json', 'Request-Id': newId('req'), 'Idempotency-Key': String(idem), 'Idempotent-Replayed': 'true' });
      res.end(hit.body);
      return;
    }
    const p = parseForm(raw);
    let out: Obj;
    let m: RegExpExecArray | null;
    if (method === 'POST' && path === '/v1/checkout/sessions') out = createSession(p);
    else if (method === 'GET' && (m = /^\/v1\/checkout\/sessions\/([\w]+)$/.exec(path))) out = sessionOr404(m[1]);
    else if (method === 'POST' && (m = /^\/v1\/checkout\/sessions\/([\w]+)\/expire$/.exec(path))) out = expireSession(m[1]);
    else if (method === 'GET' && (m = /^\/v1\/payment_intents\/([\w]+)$/.exec(path))) {
      const pi = intents.get(m[1]);
      if (!pi) throw new ApiError(404, { type: 'invalid_request_error', code: 'resource_missing', message: `No such payment_intent: '${m[1]}'`, param: 'intent' });
      out = pi;
    } else if (method === 'POST' && path === '/v1/refunds') out = createRefund(p);
    else if (method === 'GET' && (m = /^\/v1\/refunds\/([\w]+)$/.exec(path))) {
      const r = refunds.get(m[1]);
      if (!r) throw new ApiError(404, { type: 'invalid_request_error', code: 'resource_missing', message: `No such refund: '${m[1]}'`, param: 'id' });
      out = r;
    } else throw new ApiError(404, { type: 'invalid_request_error', message: `Unrecognized request URL (${method}: ${path}). This local test service implements only the calls Lanewright makes.` });
    const body = JSON.stringify(out, null, 2);
    if (idemKey) idempotent.set(idemKey, { status: 200, body });
    res.writeHead(200, { 'Content-Type': 'application/json', 'Request-Id': newId('req'), 'Stripe-Version': String(req.headers['stripe-version'] ?? API_VERSION) });
    res.end(body);
  }

  // ---- the hosted pages -------------------------------------------------------------------------------

  function pageInfo(s: Obj) {
    return { id: String(s.id), productName: sessionExtras.get(String(s.id))?.productName ?? 'Payment', amount: Number(s.amount_total), currency: String(s.currency), email: (s.customer_email as string | null) ?? null };
  }

  function newIntent(s: Obj): Obj {
    const extra = sessionExtras.get(String(s.id));
    const pi: Obj = {
      id: newId('pi'),
      object: 'payment_intent',
      amount: s.amount_total,
      amount_received: 0,
      currency: s.currency,
      created: now(),
      description: extra?.description ?? null,
      last_payment_error: null,
      latest_charge: null,
      livemode: false,
      metadata: { ...(extra?.intentMetadata ?? {}) },
      payment_method_types: ['card'],
      status: 'requires_payment_method',
    };
    intents.set(String(pi.id), pi);
    s.payment_intent = pi.id;
    return pi;
  }

  async function succeed(s: Obj, pi: Obj, last4: string): Promise<void> {
    const ch: Obj = {
      id: newId('ch'),
      object: 'charge',
      amount: pi.amount,
      amount_captured: pi.amount,
      amount_refunded: 0,
      captured: true,
      created: now(),
      currency: pi.currency,
      livemode: false,
      metadata: { ...(pi.metadata as Obj) },
      paid: true,
      payment_intent: pi.id,
      payment_method_details: { type: 'card', card: { brand: last4 === '4444' ? 'mastercard' : 'visa', last4 } },
      refunded: false,
      status: 'succeeded',
    };
    charges.set(String(ch.id), ch);
    Object.assign(pi, { status: 'succeeded', amount_received: pi.amount, latest_charge: ch.id, last_payment_error: null });
    Object.assign(s, { status: 'complete', payment_status: 'paid', url: null });
    void emit('charge.succeeded', ch);
    void emit('payment_intent.succeeded', pi);
    const completed = emit('checkout.session.completed', s);
    // Like the real flow the browser is redirected at once, but give the receiver a moment so the page it lands on is up to date.
    await Promise.race([completed, new Promise((r) => setTimeout(r, redirectWaitMs))]);
  }

  function fail(pi: Obj, error: Obj): void {
    Object.assign(pi, { status: 'requires_payment_method', last_payment_error: error });
    void emit('payment_intent.payment_failed', pi);
  }

  const redirect = (res: ServerResponse, to: string) => {
    res.writeHead(303, { Location: to, 'Cache-Control': 'no-store' });
    res.end();
  };
  const html = (res: ServerResponse, status: number, body: string) => {
    res.writeHead(status, { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'no-store', 'Content-Security-Policy': "default-src 'none'; style-src 'unsafe-inline'; form-action *; frame-ancestors 'none'" });
    res.end(body);
  };
  const successUrl = (s: Obj) => String(s.success_url).replace('{CHECKOUT_SESSION_ID}', String(s.id));

  async function pay(req: IncomingMessage, res: ServerResponse, path: string): Promise<void> {
    const m = /^\/pay\/([\w]+)(\/challenge|\/cancel)?$/.exec(path);
    const s = m ? sessions.get(m[1]) : undefined;
    if (!m || !s) return html(res, 404, closedPage('missing', null));
    const sub = m[2] ?? '';
    if (sub === '/cancel') return s.cancel_url ? redirect(res, String(s.cancel_url)) : html(res, 200, closedPage(String(s.status), null));
    if (s.status !== 'open') return html(res, s.status === 'complete' ? 200 : 410, closedPage(String(s.status), s.status === 'complete' ? successUrl(s) : ((s.cancel_url as string | null) ?? null)));
    if ((req.method ?? 'GET') === 'GET') return html(res, 200, cardPage(pageInfo(s)));
    if (req.method !== 'POST') return html(res, 405, closedPage('missing', null));
    const form = new URLSearchParams(await readBody(req, 16 * 1024));

    if (sub === '/challenge') {
      const pi = intents.get(form.get('payment_intent') ?? '');
      if (!pi || pi.status !== 'requires_action' || s.payment_intent !== pi.id) return html(res, 400, cardPage(pageInfo(s), 'This confirmation is no longer valid; enter your card again.'));
      if (form.get('outcome') === 'approve') {
        await succeed(s, pi, '3155');
        return redirect(res, successUrl(s));
      }
      const msg = 'We are unable to authenticate your payment method. Please choose a different payment method and try again.';
      fail(pi, { type: 'card_error', code: 'payment_intent_authentication_failure', message: msg });
      return html(res, 402, cardPage(pageInfo(s), msg));
    }

    const number = (form.get('cardnumber') ?? '').replace(/[\s-]/g, '');
    const exp = (form.get('exp') ?? '').replace(/\s/g, '');
    const cvc = form.get('cvc') ?? '';
    const values = { name: form.get('name') ?? '', exp: form.get('exp') ?? '' };
    if (!/^\d{12,19}$/.test(number) || !luhn(number)) return html(res, 400, cardPage(pageInfo(s), 'Your card number is invalid.', values));
    const em = /^(\d{2})\/?(\d{2}|\d{4})$/.exec(exp);
    const month = em ? Number(em[1]) : 0;
    const year = em ? (em[2].length === 2 ? 2000 + Number(em[2]) : Number(em[2])) : 0;
    const today = new Date();
    if (!em || month < 1 || month > 12 || year * 12 + month < today.getUTCFullYear() * 12 + today.getUTCMonth() + 1)
      return html(res, 400, cardPage(pageInfo(s), "Your card's expiration date is incomplete or in the past.", values));
    if (!/^\d{3,4}$/.test(cvc)) return html(res, 400, cardPage(pageInfo(s), "Your card's security code is incomplete.", values));

    const pi = s.payment_intent ? intents.get(String(s.payment_intent))! : newIntent(s);
    if (CARD_OK.includes(number)) {
      await succeed(s, pi, number.slice(-4));
      return redirect(res, successUrl(s));
    }
    if (number === CARD_DECLINED) {
      const msg = 'Your card was declined.';
      fail(pi, { type: 'card_error', code: 'card_declined', decline_code: 'generic_decline', message: msg });
      return html(res, 402, cardPage(pageInfo(s), `${msg} Try another card.`, values));
    }
    if (number === CARD_3DS) {
      Object.assign(pi, { status: 'requires_action', next_action: { type: 'redirect_to_url', redirect_to_url: { url: `${base}/pay/${String(s.id)}/challenge`, return_url: successUrl(s) } } });
      return html(res, 200, challengePage(pageInfo(s), String(pi.id)));
    }
    return html(res, 402, cardPage(pageInfo(s), 'Your card number is incorrect. In test mode use one of the test cards below.', values));
  }

  const server = http.createServer((req, res) => {
    const path = (req.url ?? '/').split('?')[0];
    const handle = path.startsWith('/v1/') ? api(req, res, path) : path.startsWith('/pay/') ? pay(req, res, path) : Promise.resolve(html(res, 404, closedPage('missing', null)));
    if (opts.stateFile && req.method === 'POST') void handle.finally(() => saveState()).catch(() => undefined);
    handle.catch((err: unknown) => {
      if (res.headersSent) return res.end();
      const e = err instanceof ApiError ? err : new ApiError(500, { type: 'api_error', message: 'An unexpected error occurred in the local payment service.' });
      res.writeHead(e.status, { 'Content-Type': 'application/json', 'Request-Id': newId('req') });
      res.end(JSON.stringify({ error: e.body }));
    });
  });
  server.keepAliveTimeout = 2000;
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, host, () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  base = `http://${host}:${port}`;
  // Open sessions kept from an earlier run are paid at this run's address.
  for (const s of sessions.values()) if (s.status === 'open') s.url = `${base}/pay/${String(s.id)}`;

  return {
    url: base,
    port,
    host,
    setWebhookUrl(url) {
      webhookUrl = url;
    },
    events,
    deliveries,
    idle: () => (pending === 0 ? Promise.resolve() : new Promise<void>((r) => idleWaiters.push(r))),
    async close() {
      closed = true;
      for (const t of timers) clearTimeout(t);
      timers.clear();
      pending = 0;
      settle();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
