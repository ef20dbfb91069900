import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { root, runTsx } from '../helpers/database';
import { DEMO, launchBrowser, openSession, signIn } from '../e2e/browser';
import { ownCluster, startServer, type OwnCluster, type ServerProcess } from './harness';

/**
 * The built client runs under the server's Content-Security-Policy: the main screens of each role open in
 * Chromium with no CSP violation (securitypolicyviolation events and console reports), and the policy is
 * the one the server sends (no inline scripts, no other origins).
 */
let cluster: OwnCluster;
let server: ServerProcess;
let browser: Browser;
const distDir = path.join(root, 'dist', `csp-client-${process.pid}`);

beforeAll(async () => {
  cluster = await ownCluster('csp');
  runTsx(['seeders/index.ts'], cluster.url);
  const build = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'error', '--outDir', distDir], { cwd: root, encoding: 'utf8' });
  if (build.status !== 0) throw new Error(`vite build failed:\n${build.stdout}\n${build.stderr}`);
  server = await startServer({ DATABASE_URL: cluster.url, CLIENT_DIST: distDir });
  browser = await launchBrowser();
}, 240000);
afterAll(async () => {
  await browser?.close();
  await server?.kill();
  cluster?.remove();
  fs.rmSync(distDir, { recursive: true, force: true });
});

const SCREENS: Record<string, string[]> = {
  [DEMO.dana]: ['/', '/arsenal', '/catalogue', '/matchup', '/patterns', '/conditions', '/sessions', '/stats', '/orders', '/profile'],
  [DEMO.proprietor]: ['/center-admin', '/patterns/new'],
  [DEMO.coach]: ['/coach'],
  [DEMO.admin]: ['/admin/users'],
};

describe('Content-Security-Policy', () => {
  it('the server sends a strict policy on the client and the API', async () => {
    const res = await fetch(`${server.base}/`);
    const csp = res.headers.get('content-security-policy') ?? '';
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect((await fetch(`${server.base}/api/health`)).headers.get('content-security-policy')).toBe(csp);
  });

  it('the main screens of every role open without a CSP violation', async () => {
    const violations: string[] = [];
    let visited = 0;
    for (const [email, paths] of Object.entries(SCREENS)) {
      const s = await openSession(browser, server.base);
      await s.context.addInitScript(() => {
        document.addEventListener('securitypolicyviolation', (e) => {
          console.error(`CSP violation: ${e.violatedDirective} blocked ${e.blockedURI} (${e.sourceFile}:${e.lineNumber})`);
        });
      });
      s.page.on('console', (m) => {
        if (/Content.Security.Policy|CSP violation|Refused to (load|execute|apply|connect|frame)/i.test(m.text())) violations.push(`${email} ${s.page.url()}: ${m.text()}`);
      });
      await signIn(s.page, email);
      for (const p of paths) {
        await s.page.goto(p);
        await s.page.waitForLoadState('networkidle');
        await s.page.locator('h1').first().waitFor();
        visited += 1;
      }
      expect(s.pageErrors, `${email}: page errors`).toEqual([]);
      await s.context.close();
    }
    expect(visited).toBe(Object.values(SCREENS).flat().length);
    expect(violations).toEqual([]);
  });
});
