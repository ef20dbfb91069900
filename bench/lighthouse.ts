/**
 * Lighthouse audits of the installable app (a part of `npm run bench`; alone: `npm run bench:lighthouse`): the
 * production server on a throwaway PostgreSQL with the demo seed and the built client, audited by Lighthouse 12 in
 * Debian's Chromium (/usr/bin/chromium, started by chrome-launcher; no browser is downloaded).
 *
 *  - accessibility and best-practices scores (0–100) of the sign-in page, Home, the arsenal and a session screen
 *    (the signed-in pages as the demo bowler Dana: her token is put in the page's storage first and Lighthouse keeps
 *    the storage between runs), Lighthouse's mobile emulation; target: accessibility ≥ 90 on every page
 *  - installability: Lighthouse 12 has no PWA category any more (removed in Lighthouse 12.0), so the same Chromium is
 *    asked directly over the DevTools protocol: `Page.getInstallabilityErrors` (the browser's own installability check:
 *    manifest, icons, service worker in control) and `Page.getAppManifest` (the manifest as parsed, its errors);
 *    plus the service worker's state and a reload with no connection (the shell and the Home heading still appear);
 *    target: no installability error, no manifest error, the offline reload opens the app.
 *
 * Written to bench/results.json under "lighthouse".
 */
import type { ChildProcess } from 'node:child_process';
import path from 'node:path';
import * as chromeLauncher from 'chrome-launcher';
import lighthouse from 'lighthouse';
import { chromium } from 'playwright-core';
import {
  bin,
  migrateAndSeed,
  root,
  run,
  serverErrors,
  signIn,
  startServer,
  stopAll,
  throwawayCluster,
  writeResults,
} from './lib/benchServer';
import { productionEnv } from './lib/productionEnv';
import { freePort } from '../scripts/lib/pg.mjs';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const CATEGORIES = ['accessibility', 'best-practices'] as const;
const ACCESSIBILITY_TARGET = 90;

interface PageScores {
  page: string;
  path: string;
  accessibility: number | null;
  bestPractices: number | null;
  /** The audits of either category that did not pass (score below 1), by id, with Lighthouse's title. */
  failing: { id: string; title: string }[];
}

async function audit(port: number, url: string, label: string, pathName: string): Promise<PageScores> {
  const result = await lighthouse(
    url,
    { port, output: 'json', logLevel: 'error', onlyCategories: [...CATEGORIES], disableStorageReset: true },
    undefined,
  );
  if (!result) throw new Error(`Lighthouse returned nothing for ${url}`);
  const { lhr } = result;
  if (lhr.runtimeError) throw new Error(`Lighthouse on ${url}: ${lhr.runtimeError.code} ${lhr.runtimeError.message}`);
  const score = (id: string) => {
    const s = lhr.categories[id]?.score;
    return typeof s === 'number' ? Math.round(s * 100) : null;
  };
  const failing: { id: string; title: string }[] = [];
  for (const id of CATEGORIES)
    for (const ref of lhr.categories[id]?.auditRefs ?? []) {
      const a = lhr.audits[ref.id];
      if (ref.weight > 0 && a && typeof a.score === 'number' && a.score < 1) failing.push({ id: a.id, title: a.title });
    }
  return { page: label, path: pathName, accessibility: score('accessibility'), bestPractices: score('best-practices'), failing };
}

async function main(): Promise<void> {
  const { dir, adminUrl } = await throwawayCluster('lanewright-lighthouse-');
  let server: ChildProcess | null = null;
  let chrome: chromeLauncher.LaunchedChrome | null = null;
  let output = () => '';
  try {
    const env = productionEnv(adminUrl);
    migrateAndSeed(env);
    const distDir = path.join(root, 'dist', 'lighthouse-client');
    run(bin('vite'), ['build', '--logLevel', 'error', '--outDir', distDir], env);
    const port = await freePort();
    const started = await startServer({
      env: { ...env, CLIENT_DIST: distDir, RATE_LIMIT_AUTH: '100000', LOG_LEVEL: 'error' },
      port,
      tries: 150,
      collect: true,
    });
    server = started.server;
    output = started.output;
    const { base } = started;
    const auth = await signIn(base, 'dana@copperline.example');
    const token = auth.authorization.replace(/^Bearer /, '');
    const session = (await (
      await fetch(`${base}/api/sessions`, {
        method: 'POST',
        headers: auth,
        body: JSON.stringify({ kind: 'practice', date: new Date().toISOString().slice(0, 10) }),
      })
    ).json()) as { item?: { id: number } };
    if (!session.item) throw new Error('could not start a session for the audit');

    chrome = await chromeLauncher.launch({
      chromePath: CHROMIUM,
      chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
    });
    console.log(`[lighthouse] Chromium on port ${chrome.port}, app at ${base}`);

    const pages: PageScores[] = [];
    pages.push(await audit(chrome.port, `${base}/sign-in`, 'Sign in', '/sign-in'));

    // Dana signs in: her token in the origin's storage, where the app reads it (Lighthouse keeps storage: above).
    const cdp = await chromium.connectOverCDP(`http://127.0.0.1:${chrome.port}`);
    const context = cdp.contexts()[0];
    const page = await context.newPage();
    await page.goto(`${base}/sign-in`);
    await page.evaluate((t) => window.localStorage.setItem('lanewright.token', t), token);
    await page.goto(`${base}/`);
    await page.getByRole('heading', { level: 1, name: /^Welcome,/ }).waitFor({ timeout: 60000 });

    // Installability, as the browser itself decides it, once the service worker is in control.
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await page.reload();
    await page.getByRole('heading', { level: 1, name: /^Welcome,/ }).waitFor({ timeout: 60000 });
    const client = await context.newCDPSession(page);
    const { installabilityErrors } = (await client.send('Page.getInstallabilityErrors')) as {
      installabilityErrors: { errorId: string; errorArguments: { name: string; value: string }[] }[];
    };
    const manifest = (await client.send('Page.getAppManifest')) as { url: string; errors: { message: string; critical: number }[] };
    const serviceWorker = await page.evaluate(async () => ({
      controlled: navigator.serviceWorker.controller !== null,
      state: (await navigator.serviceWorker.ready).active?.state ?? null,
      scope: (await navigator.serviceWorker.ready).scope,
    }));
    // A reload with no connection: the shell comes from the service worker, the user from the offline copies.
    await context.setOffline(true);
    await page.reload();
    const offlineReload = await page
      .getByRole('heading', { level: 1, name: /^Welcome,/ })
      .waitFor({ timeout: 30000 })
      .then(() => true)
      .catch(() => false);
    await context.setOffline(false);
    await client.detach();
    await page.close();
    await cdp.close();

    pages.push(await audit(chrome.port, `${base}/`, 'Home', '/'));
    pages.push(await audit(chrome.port, `${base}/arsenal`, 'Arsenal', '/arsenal'));
    pages.push(await audit(chrome.port, `${base}/sessions/${session.item.id}`, 'Session', '/sessions/:id'));

    const installable = {
      method: 'Chromium DevTools protocol: Page.getInstallabilityErrors and Page.getAppManifest (Lighthouse 12 has no PWA category)',
      installabilityErrors: installabilityErrors.map((e) => [e.errorId, ...e.errorArguments.map((a) => `${a.name}=${a.value}`)].join(' ')),
      manifestUrl: manifest.url,
      manifestErrors: manifest.errors.map((e) => e.message),
      serviceWorker,
      offlineReload,
    };
    const met = {
      accessibility: pages.every((p) => (p.accessibility ?? 0) >= ACCESSIBILITY_TARGET),
      installable: installable.installabilityErrors.length === 0 && installable.manifestErrors.length === 0 && serviceWorker.controlled,
      offlineReload,
    };
    for (const p of pages)
      console.log(
        `[lighthouse] ${p.page.padEnd(8)} accessibility ${p.accessibility} · best practices ${p.bestPractices}` +
          (p.failing.length ? ` · not passed: ${p.failing.map((f) => f.id).join(', ')}` : ''),
      );
    console.log(
      `[lighthouse] installable: ${met.installable ? 'yes' : `no (${[...installable.installabilityErrors, ...installable.manifestErrors].join('; ')})`}` +
        ` · offline reload opens the app: ${offlineReload ? 'yes' : 'no'}`,
    );
    writeResults('lighthouse', {
      date: new Date().toISOString(),
      lighthouse: '12',
      chromium: CHROMIUM,
      formFactor: 'mobile (Lighthouse default emulation)',
      targets: {
        accessibility: `>= ${ACCESSIBILITY_TARGET} on every page`,
        installable: 'no installability or manifest error',
        offlineReload: true,
      },
      pages,
      installable,
      met,
    });
    if (!met.accessibility || !met.installable || !met.offlineReload) process.exitCode = 1;
  } catch (err) {
    console.error(err);
    const errs = serverErrors(output());
    if (errs) console.error(errs);
    process.exitCode = 1;
  } finally {
    if (chrome) chrome.kill();
    await stopAll(server, dir, 500);
  }
}

await main();
