/** The hosted pages of the payment fake: card form, authentication challenge, closed checkout. Plain HTML, no script. */
import esc from 'escape-html';
import { formatMoney } from '../../../shared/shop';

/** "$45.00": the amount as the hosted page shows it. */
export const money = (cents: number, currency: string): string => formatMoney(cents, currency);

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(title)}</title>
<style>
  *{box-sizing:border-box} body{font-family:system-ui,sans-serif;margin:0;background:#f3f6f6;color:#1b2424}
  main{max-width:26rem;margin:0 auto;padding:1.25rem}
  .card{background:#fff;border-radius:10px;padding:1.25rem;box-shadow:0 1px 4px rgba(0,0,0,.12)}
  h1{font-size:1.25rem;margin:0 0 .25rem} .amount{font-size:1.6rem;font-weight:700;margin:.25rem 0 1rem}
  .mode{display:inline-block;background:#fff3d6;color:#6b4500;border-radius:4px;padding:.1rem .45rem;font-size:.8rem;font-weight:600}
  label{display:block;font-weight:600;margin:.75rem 0 .25rem} input{width:100%;font-size:1.05rem;padding:.6rem;border:1px solid #9aa9a9;border-radius:6px}
  .row{display:flex;gap:.75rem} .row>div{flex:1}
  button{font-size:1.05rem;padding:.7rem 1rem;border:0;border-radius:6px;background:#0f5f5c;color:#fff;font-weight:600;cursor:pointer;width:100%;margin-top:1rem}
  button.secondary{background:#e4ebeb;color:#1b2424}
  .error{background:#fde8e8;color:#8a1111;border-radius:6px;padding:.6rem .75rem;margin:.75rem 0}
  .hint{font-size:.85rem;color:#4a5757;margin-top:1rem} a{color:#0f5f5c} code{font-size:.85rem}
</style></head><body><main>${body}</main></body></html>`;
}

export function cardPage(
  s: { id: string; productName: string; amount: number; currency: string; email: string | null },
  error?: string,
  values: { name?: string; exp?: string } = {},
): string {
  return layout(
    `Pay ${money(s.amount, s.currency)}`,
    `<div class="card">
  <span class="mode">Test mode</span>
  <h1>${esc(s.productName)}</h1>
  <p class="amount" id="amount">${esc(money(s.amount, s.currency))}</p>
  ${s.email ? `<p>Receipt to ${esc(s.email)}</p>` : ''}
  ${error ? `<p class="error" role="alert" id="card-error">${esc(error)}</p>` : ''}
  <form method="post" action="/pay/${esc(s.id)}" aria-label="Card details">
    <label for="cardnumber">Card number</label>
    <input id="cardnumber" name="cardnumber" inputmode="numeric" autocomplete="cc-number" placeholder="1234 1234 1234 1234" required maxlength="23">
    <div class="row">
      <div><label for="exp">Expiry (MM / YY)</label><input id="exp" name="exp" autocomplete="cc-exp" placeholder="MM / YY" required maxlength="7" value="${esc(values.exp ?? '')}"></div>
      <div><label for="cvc">CVC</label><input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" placeholder="123" required maxlength="4"></div>
    </div>
    <label for="cardname">Name on card</label>
    <input id="cardname" name="name" autocomplete="cc-name" value="${esc(values.name ?? '')}">
    <button type="submit" id="pay">Pay ${esc(money(s.amount, s.currency))}</button>
  </form>
  <form method="get" action="/pay/${esc(s.id)}/cancel"><button type="submit" class="secondary" id="cancel">Cancel and go back</button></form>
  <p class="hint">Test cards: <code>4242 4242 4242 4242</code> succeeds · <code>4000 0000 0000 0002</code> is declined ·
  <code>4000 0025 0000 3155</code> asks for authentication. Any future expiry, any CVC.</p>
</div>`,
  );
}

export function challengePage(s: { id: string; amount: number; currency: string }, intentId: string): string {
  return layout(
    'Confirm this payment',
    `<div class="card">
  <span class="mode">Test mode</span>
  <h1>Confirm this payment</h1>
  <p>Your card issuer asks you to confirm a payment of <strong>${esc(money(s.amount, s.currency))}</strong>.</p>
  <form method="post" action="/pay/${esc(s.id)}/challenge">
    <input type="hidden" name="payment_intent" value="${esc(intentId)}">
    <button type="submit" name="outcome" value="approve" id="approve">Approve</button>
    <button type="submit" name="outcome" value="fail" class="secondary" id="fail">Fail authentication</button>
  </form>
</div>`,
  );
}

export function closedPage(status: string, back: string | null): string {
  const what =
    status === 'complete'
      ? 'This checkout is already paid.'
      : status === 'expired'
        ? 'This checkout has expired.'
        : 'This checkout does not exist.';
  return layout(
    'Checkout closed',
    `<div class="card"><h1>${esc(what)}</h1>${back ? `<p><a href="${esc(back)}">Go back</a></p>` : ''}</div>`,
  );
}
