import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { apiHandler } from './api';
import { cardPageHandler, html } from './cardPage';
import { closedPage } from './pages';
import { ApiError, FakeState, newId, type StripeFake, type StripeFakeOptions } from './state';
import { Webhooks } from './webhooks';

export type { FakeDelivery, FakeEvent, StripeFake, StripeFakeOptions } from './state';

/**
 * A small local stand-in for the few card-payment API calls Lanewright makes, speaking the real protocol:
 * form-encoded requests under /v1 with a bearer secret key, JSON objects shaped like the real ones,
 * errors as `{error: {type, code, message, param}}`, idempotency keys honoured (api.ts); a hosted card page and
 * an authentication challenge (cardPage.ts); webhook events POSTed to the configured URL, signed like the real
 * service and retried until answered 2xx (webhooks.ts); its records in state.ts.
 *
 * Test cards: 4242 4242 4242 4242 succeeds; 4000 0000 0000 0002 is declined; 4000 0025 0000 3155
 * requires authentication (Approve → succeeds, Fail → payment fails).
 */
export async function startStripeFake(opts: StripeFakeOptions): Promise<StripeFake> {
  const host = opts.host ?? '127.0.0.1';
  const state = new FakeState(opts.stateFile);
  const webhooks = new Webhooks(opts.webhookSecret, opts.retryDelaysMs ?? [500, 2000, 5000, 15000, 60000], opts.webhookUrl ?? null);
  const api = apiHandler(opts, state, webhooks);
  const pay = cardPageHandler(opts, state, webhooks);

  const server = http.createServer((req, res) => {
    const path = (req.url ?? '/').split('?')[0];
    const handle = path.startsWith('/v1/')
      ? api(req, res, path)
      : path.startsWith('/pay/')
        ? pay(req, res, path)
        : Promise.resolve(html(res, 404, closedPage('missing', null)));
    if (opts.stateFile && req.method === 'POST') void handle.finally(() => state.save()).catch(() => undefined);
    handle.catch((err: unknown) => {
      if (res.headersSent) return res.end();
      const e =
        err instanceof ApiError
          ? err
          : new ApiError(500, { type: 'api_error', message: 'An unexpected error occurred in the local payment service.' });
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
  state.base = `http://${host}:${port}`;
  // Open sessions kept from an earlier run are paid at this run's address.
  for (const s of state.sessions.values()) if (s.status === 'open') s.url = `${state.base}/pay/${String(s.id)}`;

  return {
    url: state.base,
    port,
    host,
    setWebhookUrl(url) {
      webhooks.url = url;
    },
    events: webhooks.events,
    deliveries: webhooks.deliveries,
    idle: () => webhooks.idle(),
    async close() {
      webhooks.close();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
