import express, { type Express } from 'express';
import compression from 'compression';
import helmet from 'helmet';
import fs from 'node:fs';
import path from 'node:path';
import { config } from './config/index';
import { groupRouter, type RouteGroup } from './http/route';
import { ROUTE_TABLE } from './routes';
import { mailCaptureEnabled } from './lib/mailer';
import { metricsMiddleware } from './lib/metrics';
import { passportInitialize } from './middleware/auth';
import { errorHandler, notFound } from './middleware/errorHandler';
import { uploadRateLimit } from './middleware/rateLimit';
import { jsonDepthGuard } from './middleware/jsonDepth';
import { requestId } from './middleware/requestId';

/**
 * Developer tools (the admin's dev mailbox) exist only outside production, and only while the in-process
 * capture SMTP server is in use: a dynamic import, so a production process never loads their code.
 */
const devTools = mailCaptureEnabled && config.NODE_ENV !== 'production' ? await import('./features/dev/dev.routes') : null;

/** Files of the installable app that must never be served from the HTTP cache (vite-plugin-pwa's output). */
const SERVICE_WORKER_FILES = /^(sw\.js|workbox-[\w-]+\.js|manifest\.webmanifest)$/;

/** Builds the Express app: the API under /api and, when built, the client. Listening is index.ts's job. */
export function createApp(): Express {
  const app = express();
  app.disable('x-powered-by');
  // API answers are per-user JSON; hashing every body for an ETag costs more than it saves.
  app.set('etag', false);
  // Whose X-Forwarded-For to believe (client addresses for the rate limits): none unless configured —
  // behind a load balancer set TRUST_PROXY to its hop count or subnet (README, Configuration).
  app.set('trust proxy', config.TRUST_PROXY);
  app.use(requestId);
  app.use(metricsMiddleware);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          // The service worker (sw.js), the engine's module worker and the web app manifest come from this origin only.
          'worker-src': ["'self'"],
          'manifest-src': ["'self'"],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'upgrade-insecure-requests': null,
        },
      },
      strictTransportSecurity: config.NODE_ENV === 'production',
    }),
  );
  // gzip for clients that accept it (every browser): a 15-ball matchup's JSON shrinks about sixfold on the wire.
  app.use(compression());
  app.use(passportInitialize);

  const groups: RouteGroup[] = [...ROUTE_TABLE, ...(devTools ? [devTools.devRoutes] : [])];
  // The payment webhook reads its body raw (the signature covers the exact bytes): before the JSON parser.
  for (const g of groups.filter((x) => x.rawBody)) app.use(`/api${g.prefix}`, groupRouter(g));
  const api = express.Router();
  api.use(express.json({ limit: config.BODY_LIMIT, verify: jsonDepthGuard }));
  api.use(uploadRateLimit);
  for (const g of groups.filter((x) => !x.rawBody)) api.use(g.prefix, groupRouter(g));
  api.use(notFound);
  api.use(errorHandler);
  app.use('/api', api);

  const dist = path.resolve(config.CLIENT_DIST);
  const indexHtml = path.join(dist, 'index.html');
  if (fs.existsSync(indexHtml)) {
    app.use(
      express.static(dist, {
        index: false,
        maxAge: '1h',
        setHeaders: (res, file) => {
          if (file.includes(`${path.sep}assets${path.sep}`)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
          // The service worker, its Workbox runtime and the manifest are checked on every visit, so a new version
          // is found at once (the browser then offers it; the bowler decides when to load it).
          else if (SERVICE_WORKER_FILES.test(path.basename(file))) res.setHeader('Cache-Control', 'no-cache');
        },
      }),
    );
    app.get(/^(?!\/api\/).*/, (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(indexHtml);
    });
  } else {
    app.get('/', (_req, res) => {
      res.type('text/plain').send('Lanewright API is running. The client is not built: run `npm run build` (npm start does this).');
    });
  }
  app.use(notFound);
  app.use(errorHandler);
  return app;
}
