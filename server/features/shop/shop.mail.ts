import esc from 'escape-html';
import type { Transaction } from 'sequelize';
import { formatMoney } from '../../../shared/shop';
import { enqueueMail } from '../../lib/outbox';
import type { Order } from '../../models/index';
import { shopRepository } from './shop.repository';

type Kind = 'receipt' | 'ready' | 'refunded';

const SUBJECT: Record<Kind, (o: Order, center: string) => string> = {
  receipt: (o, c) => `${c}: receipt for order #${o.id} — ${o.serviceName}`,
  ready: (o, c) => `${c}: your ball is ready — order #${o.id}`,
  refunded: (o, c) => `${c}: order #${o.id} refunded`,
};

/** The receipt (on payment) and status mails (ready, refunded) to the bowler, through the outbox in the caller's transaction. */
export async function enqueueOrderMail(kind: Kind, order: Order, base: string, transaction: Transaction): Promise<void> {
  const [bowler, center] = await shopRepository.orderParties(order, transaction);
  if (!bowler || !center) return;
  const amount = formatMoney(order.amountCents, order.currency);
  const page = `${base}/orders/${order.id}`;
  const body: Record<Kind, string[]> = {
    receipt: [
      `Thank you: ${center.name} has your payment.`,
      '',
      `Order #${order.id}: ${order.serviceName}`,
      `Ball: ${order.ballName}`,
      `Paid by card: ${amount} on ${(order.paidAt ?? new Date()).toISOString().slice(0, 10)}`,
      '',
      'The shop tells you by e-mail when the ball is ready to collect.',
    ],
    ready: [
      `${order.ballName} is ready to collect at ${center.name} (${order.serviceName}).`,
      ...(order.grit && order.serviceKind === 'resurface'
        ? [`Its surface is now ${order.grit} grit; your ball page and matchups use the new surface.`]
        : []),
      ...(order.serviceKind === 'polish' ? ['It is now polished; your ball page and matchups use the new surface.'] : []),
    ],
    refunded: [
      `${center.name} has refunded order #${order.id} (${order.serviceName}, ${order.ballName}): ${amount} back to your card.`,
      'Card refunds usually show within 5–10 business days.',
    ],
  };
  const lines = [`Hello ${bowler.displayName},`, '', ...body[kind], '', `Your order: ${page}`];
  await enqueueMail(
    [
      {
        to: bowler.email,
        kind: `order_${kind}`,
        ref: `${order.id}:${kind}`,
        subject: SUBJECT[kind](order, center.name).slice(0, 200),
        text: lines.join('\n'),
        html: `<p>${lines.map(esc).join('<br>')}</p><p><a href="${esc(page)}">Open the order</a></p>`,
      },
    ],
    transaction,
  );
}
