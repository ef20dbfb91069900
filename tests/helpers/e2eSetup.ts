import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { freshDatabase, root, runTsx, throwawayCluster } from './database';
import './apiSetup'; // the ProvidedContext keys

/** The template every browser test file's server gets its own copy of. */
export const E2E_TEMPLATE = 'lw_e2e';

/**
 * Global setup of the browser tests: database `lw_e2e` migrated and seeded with the demo data, and the client built
 * once by Vite. Neither is used directly: each browser test file starts the real server on its own copy of the
 * seeded database (tests/helpers/e2eServer.ts), so what one file does to the demo accounts (a role changed, a ball
 * resurfaced, a profile saved) is never seen by another, whatever order the files run in.
 */
export default async function setup(project: TestProject): Promise<() => void> {
  const cluster = await throwawayCluster();
  const url = await freshDatabase(cluster.adminUrl, E2E_TEMPLATE);
  runTsx(['seeders/index.ts'], url);
  const distDir = path.join(root, 'dist', `e2e-client-${process.pid}`);
  const build = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'error', '--outDir', distDir], { cwd: root, encoding: 'utf8' });
  if (build.status !== 0) throw new Error(`vite build failed:\n${build.stdout}\n${build.stderr}`);
  project.provide('pgAdminUrl', cluster.adminUrl);
  project.provide('e2eTemplate', E2E_TEMPLATE);
  project.provide('e2eClientDist', distDir);

  return () => {
    fs.rmSync(distDir, { recursive: true, force: true });
    cluster.stop();
  };
}
