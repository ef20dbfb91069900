import crypto from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { parseForm, str, strMap, type FormValue } from './form';
import { API_VERSION, ApiError, missing, newId, now, type FakeState, type Obj, type StripeFakeOptions } from './state';
import type { Webhooks } from './webhooks';

/** Reads a request body up to `limit` bytes (413 in the API's error shape beyond it). */
export function readBody(req: IncomingMessage, limit = 256 * 1024): Promise<string> {
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

export function intParam(v: FormValue | undefined, param: string, required = true): number | undefined {
  const s = str(v);
  if (s === undefined) {
    if (required)
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'parameter_missing',
        message: `Missing required param: ${param}.`,
        param,
      });
    return undefined;
  }
  if (!/^\d+$/.test(s))
    throw new ApiError(400, { type: 'invalid_request_error', code: 'parameter_invalid_integer', message: `Invalid integer: ${s}`, param });
  return Number(s);
}

/**
 * The fake's API: the few calls Lanewright makes, form-encoded under /v1 with a bearer secret key, answered with
 * JSON objects shaped like the real ones; idempotency keys honoured.
 */
export function apiHandler(opts: Pick<StripeFakeOptions, 'apiKey'>, state: FakeState, webhooks: Webhooks) {
  const { sessions, intents, charges, refunds, sessionExtras, idempotent } = state;
  const emit = (type: string, object: Obj) => webhooks.emit(type, object);
  const sessionOr404 = (id: string) => state.sessionOr404(id);

  function createSession(p: Record<string, FormValue>): Obj {
    if (str(p.mode) !== 'payment')
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'parameter_invalid',
        message: 'Only mode=payment is supported here.',
        param: 'mode',
      });
    const successUrl = str(p.success_url);
    if (!successUrl)
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'parameter_missing',
        message: 'Missing required param: success_url.',
        param: 'success_url',
      });
    const items = Array.isArray(p.line_items) ? p.line_items : [];
    if (!items.length)
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'parameter_missing',
        message: 'Missing required param: line_items.',
        param: 'line_items',
      });
    let amount = 0;
    let currency: string | null = null;
    const names: string[] = [];
    items.forEach((raw, i) => {
      const it = (raw && typeof raw === 'object' && !Array.isArray(raw) ? raw : {}) as Record<string, FormValue>;
      const pd = (it.price_data && typeof it.price_data === 'object' && !Array.isArray(it.price_data) ? it.price_data : {}) as Record<
        string,
        FormValue
      >;
      const cur = str(pd.currency);
      if (!cur)
        throw new ApiError(400, {
          type: 'invalid_request_error',
          code: 'parameter_missing',
          message: 'Missing required param: line_items[0][price_data][currency].',
          param: `line_items[${i}][price_data][currency]`,
        });
      if (currency && cur !== currency)
        throw new ApiError(400, {
          type: 'invalid_request_error',
          code: 'parameter_invalid',
          message: 'All line items must share a currency.',
          param: `line_items[${i}][price_data][currency]`,
        });
      currency = cur.toLowerCase();
      const unit = intParam(pd.unit_amount, `line_items[${i}][price_data][unit_amount]`)!;
      const qty = intParam(it.quantity, `line_items[${i}][quantity]`)!;
      const product = (
        pd.product_data && typeof pd.product_data === 'object' && !Array.isArray(pd.product_data) ? pd.product_data : {}
      ) as Record<string, FormValue>;
      names.push(str(product.name) ?? 'Item');
      amount += unit * qty;
    });
    if (amount < 50)
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'amount_too_small',
        message: "The Checkout Session's total amount due must add up to at least $0.50 usd",
        param: 'line_items',
      });
    const pid = (
      p.payment_intent_data && typeof p.payment_intent_data === 'object' && !Array.isArray(p.payment_intent_data)
        ? p.payment_intent_data
        : {}
    ) as Record<string, FormValue>;
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
      url: `${state.base}/pay/${id}`,
      // Not part of the real object: what the hosted page shows and what the intent carries.
    };
    sessions.set(id, s);
    sessionExtras.set(id, {
      productName: names.join(', '),
      intentMetadata: strMap(pid.metadata),
      description: str(pid.description) ?? null,
    });
    return s;
  }

  function expireSession(id: string): Obj {
    const s = sessionOr404(id);
    if (s.status !== 'open')
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'checkout_session_not_open',
        message: `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${String(s.status)}".`,
      });
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
      if (!pi) throw missing('payment_intent', piId, 'payment_intent');
      if (!pi.latest_charge || pi.status !== 'succeeded')
        throw new ApiError(400, {
          type: 'invalid_request_error',
          code: 'charge_not_refundable',
          message: 'This PaymentIntent does not have a successful charge to refund.',
          param: 'payment_intent',
        });
      charge = charges.get(String(pi.latest_charge));
    } else if (chId) {
      charge = charges.get(chId);
      if (!charge) throw missing('charge', chId, 'charge');
    } else {
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'parameter_missing',
        message: 'One of the following params should be provided for this request: payment_intent or charge.',
      });
    }
    const c = charge!;
    const left = Number(c.amount) - Number(c.amount_refunded);
    if (left <= 0)
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'charge_already_refunded',
        message: `Charge ${String(c.id)} has already been refunded.`,
      });
    const amount = intParam(p.amount, 'amount', false) ?? left;
    if (amount > left || amount <= 0)
      throw new ApiError(400, {
        type: 'invalid_request_error',
        code: 'amount_too_large',
        message: `Refund amount (${amount}) is greater than unrefunded amount on charge (${left})`,
        param: 'amount',
      });
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

  return async function api(req: IncomingMessage, res: ServerResponse, path: string): Promise<void> {
    const auth = req.headers.authorization ?? '';
    const key = /^Bearer (sk_test_\S+)$/.exec(auth)?.[1];
    if (
      !key ||
      (opts.apiKey !== undefined &&
        !crypto.timingSafeEqual(crypto.createHash('sha256').update(key).digest(), crypto.createHash('sha256').update(opts.apiKey).digest()))
    ) {
      throw new ApiError(401, {
        type: 'invalid_request_error',
        message: auth
          ? 'Invalid API Key provided (test mode keys start with sk_test_).'
          : 'You did not provide an API key. Provide it in the Authorization header (Authorization: Bearer YOUR_SECRET_KEY).',
      });
    }
    const method = req.method ?? 'GET';
    const raw = method === 'POST' ? await readBody(req) : '';
    const idem = method === 'POST' ? req.headers['idempotency-key'] : undefined;
    const idemKey = typeof idem === 'string' ? `${key}:${path}:${idem}` : null;
    if (idemKey && idempotent.has(idemKey)) {
      const hit = idempotent.get(idemKey)!;
      res.writeHead(hit.status, {
        'Content-Type': 'application/json',
        'Request-Id': newId('req'),
        'Idempotency-Key': String(idem),
        'Idempotent-Replayed': 'true',
      });
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
      if (!pi) throw missing('payment_intent', m[1], 'intent');
      out = pi;
    } else if (method === 'POST' && path === '/v1/refunds') out = createRefund(p);
    else if (method === 'GET' && (m = /^\/v1\/refunds\/([\w]+)$/.exec(path))) {
      const r = refunds.get(m[1]);
      if (!r) throw missing('refund', m[1], 'id');
      out = r;
    } else
      throw new ApiError(404, {
        type: 'invalid_request_error',
        message: `Unrecognized request URL (${method}: ${path}). This local test service implements only the calls Lanewright makes.`,
      });
    const body = JSON.stringify(out, null, 2);
    if (idemKey) idempotent.set(idemKey, { status: 200, body });
    res.writeHead(200, {
      'Content-Type': 'application/json',
      'Request-Id': newId('req'),
      'Stripe-Version': String(req.headers['stripe-version'] ?? API_VERSION),
    });
    res.end(body);
  };
}
