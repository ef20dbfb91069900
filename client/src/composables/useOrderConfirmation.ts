import { ref, type Ref } from 'vue';
import { errorMessage } from '@/api/client';
import type { Order } from '@/api/shop';

/** How long the order page waits for the payment service's confirmation before saying it has not arrived. */
export const WAIT_MS = 60000;

export interface OrderConfirmationOptions {
  order: Ref<Order | null>;
  /** Reads the order again (throws when it cannot). */
  reload: () => Promise<void>;
  /** The order is no longer waiting for its payment. */
  onConfirmed: (order: Order) => void;
  onWaiting: () => void;
  onTimedOut: () => void;
}

/**
 * Back from the card page, the payment is not confirmed until the payment service's webhook reaches the server: the
 * order page polls the order (quick at first, then every 3 s) until it is paid or WAIT_MS have passed.
 */
export function useOrderConfirmation(options: OrderConfirmationOptions) {
  const waiting = ref(false);
  const waitTimedOut = ref(false);
  const waitError = ref('');
  let timer: ReturnType<typeof setTimeout> | null = null;
  let waitStarted = 0;

  function stopWaiting(): void {
    if (timer) clearTimeout(timer);
    timer = null;
    waiting.value = false;
  }

  /**
   * Back through the success address the card page was completed, so an earlier failed attempt on the same
   * page does not count: wait while the order is still unpaid (the confirmation may come after the redirect).
   */
  function stillUnconfirmed(o: Order | null): boolean {
    return o !== null && o.status === 'ordered';
  }

  async function poll(): Promise<void> {
    timer = null;
    try {
      await options.reload();
      waitError.value = '';
    } catch (err) {
      waitError.value = errorMessage(err, 'The order could not be checked just now; trying again.');
    }
    const o = options.order.value;
    if (!stillUnconfirmed(o)) {
      stopWaiting();
      if (o) options.onConfirmed(o);
      return;
    }
    if (Date.now() - waitStarted > WAIT_MS) {
      stopWaiting();
      waitTimedOut.value = true;
      options.onTimedOut();
      return;
    }
    // Quick at first (the confirmation usually lands within a second or two), then every 3 s.
    timer = setTimeout(() => void poll(), Date.now() - waitStarted < 10000 ? 1000 : 3000);
  }

  function startWaiting(): void {
    stopWaiting();
    waitTimedOut.value = false;
    waitError.value = '';
    waiting.value = true;
    waitStarted = Date.now();
    options.onWaiting();
    timer = setTimeout(() => void poll(), 800);
  }

  return { waiting, waitTimedOut, waitError, startWaiting, stopWaiting, stillUnconfirmed };
}
