import type { IncomingMessage, ServerResponse } from 'node:http';
import { readBody } from './api';
import { cardPage, challengePage, closedPage } from './pages';
import { newId, now, type FakeState, type Obj, type StripeFakeOptions } from './state';
import type { Webhooks } from './webhooks';

const CARD_OK = ['4242424242424242', '5555555555554444'];
const CARD_DECLINED = '4000000000000002';
const CARD_3DS = '4000002500003155';

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

export const html = (res: ServerResponse, status: number, body: string) => {
  res.writeHead(status, {
    'Content-Type': 'text/html; charset=utf-8',
    'Cache-Control': 'no-store',
    'Content-Security-Policy': "default-src 'none'; style-src 'unsafe-inline'; form-action *; frame-ancestors 'none'",
  });
  res.end(body);
};

/**
 * The hosted card page of a checkout (`/pay/:id`), its authentication challenge (`/challenge`) and the way back
 * (`/cancel`). A test card's payment succeeds, is declined or asks for authentication; each outcome updates the
 * payment and sends its events.
 */
export function cardPageHandler(opts: Pick<StripeFakeOptions, 'redirectWaitMs'>, state: FakeState, webhooks: Webhooks) {
  const redirectWaitMs = opts.redirectWaitMs ?? 5000;
  const { sessions, intents, charges, sessionExtras } = state;
  const emit = (type: string, object: Obj) => webhooks.emit(type, object);

  function pageInfo(s: Obj) {
    return {
      id: String(s.id),
      productName: sessionExtras.get(String(s.id))?.productName ?? 'Payment',
      amount: Number(s.amount_total),
      currency: String(s.currency),
      email: (s.customer_email as string | null) ?? null,
    };
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
  const successUrl = (s: Obj) => String(s.success_url).replace('{CHECKOUT_SESSION_ID}', String(s.id));

  return async function pay(req: IncomingMessage, res: ServerResponse, path: string): Promise<void> {
    const m = /^\/pay\/([\w]+)(\/challenge|\/cancel)?$/.exec(path);
    const s = m ? sessions.get(m[1]) : undefined;
    if (!m || !s) return html(res, 404, closedPage('missing', null));
    const sub = m[2] ?? '';
    if (sub === '/cancel') return s.cancel_url ? redirect(res, String(s.cancel_url)) : html(res, 200, closedPage(String(s.status), null));
    if (s.status !== 'open')
      return html(
        res,
        s.status === 'complete' ? 200 : 410,
        closedPage(String(s.status), s.status === 'complete' ? successUrl(s) : ((s.cancel_url as string | null) ?? null)),
      );
    if ((req.method ?? 'GET') === 'GET') return html(res, 200, cardPage(pageInfo(s)));
    if (req.method !== 'POST') return html(res, 405, closedPage('missing', null));
    const form = new URLSearchParams(await readBody(req, 16 * 1024));

    if (sub === '/challenge') {
      const pi = intents.get(form.get('payment_intent') ?? '');
      if (!pi || pi.status !== 'requires_action' || s.payment_intent !== pi.id)
        return html(res, 400, cardPage(pageInfo(s), 'This confirmation is no longer valid; enter your card again.'));
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
      Object.assign(pi, {
        status: 'requires_action',
        next_action: {
          type: 'redirect_to_url',
          redirect_to_url: { url: `${state.base}/pay/${String(s.id)}/challenge`, return_url: successUrl(s) },
        },
      });
      return html(res, 200, challengePage(pageInfo(s), String(pi.id)));
    }
    return html(res, 402, cardPage(pageInfo(s), 'Your card number is incorrect. In test mode use one of the test cards below.', values));
  };
}
