import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { freePort, makeTempClusterDir, startCluster, stopCluster } from '../../scripts/lib/pg.mjs';

export const root = path.resolve(import.meta.dirname, '..', '..');

/**
 * The admin URL of the throwaway cluster: the one `npm test` started, or (when Vitest runs directly)
 * one this helper starts and returns a stop function for.
 */
export async function throwawayCluster(): Promise<{ adminUrl: string; stop: () => void }> {
  if (process.env.TEST_PG_ADMIN_URL) return { adminUrl: process.env.TEST_PG_ADMIN_URL, stop: () => undefined };
  const dir = makeTempClusterDir('lanewright-vitest-');
  const adminUrl = await startCluster({ dataDir: `${dir}/pg`, port: await freePort(), database: 'postgres_admin', log: () => undefined });
  process.env.TEST_PG_ADMIN_URL = adminUrl;
  return {
    adminUrl,
    stop: () => {
      stopCluster(`${dir}/pg`);
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** The URL of database `name` on the cluster of `adminUrl`. */
export const databaseUrl = (adminUrl: string, name: string): string => adminUrl.replace(/\/[^/]+$/, `/${name}`);

/** Drops and creates database `name` on the cluster, migrates it with the project's migrations, returns its URL. */
export async function freshDatabase(adminUrl: string, name: string): Promise<string> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await client.query(`CREATE DATABASE ${name}`);
  } finally {
    await client.end();
  }
  const url = databaseUrl(adminUrl, name);
  runTsx(['server/db/migrate.ts', 'up'], url);
  return url;
}

let clones = 0;

/**
 * A new database copied from `template` (PostgreSQL `CREATE DATABASE … TEMPLATE`, a file-level copy: tens of
 * milliseconds, no migrations to run again), named `<template>_<pid>_<n>`; returns its name and URL. The template
 * must have no open connection while it is copied, so nothing but this function ever connects to a template.
 */
export async function cloneDatabase(adminUrl: string, template: string): Promise<{ name: string; url: string }> {
  clones += 1;
  const name = `${template}_${process.pid}_${clones}`;
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await client.query(`CREATE DATABASE ${name} TEMPLATE ${template}`);
  } finally {
    await client.end();
  }
  return { name, url: databaseUrl(adminUrl, name) };
}

/** Drops database `name` (closing any connection still open to it). */
export async function dropDatabase(adminUrl: string, name: string): Promise<void> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  } finally {
    await client.end();
  }
}

/** Runs a TypeScript entry point of the project with DATABASE_URL set; throws with its output on failure. */
export function runTsx(args: string[], databaseUrl: string): string {
  const r = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), args, {
    cwd: root,
    env: { ...process.env, DATABASE_URL: databaseUrl, NODE_ENV: 'test' },
    encoding: 'utf8',
  });
  if (r.status !== 0) throw new Error(`tsx ${args.join(' ')} failed:\n${r.stdout}\n${r.stderr}`);
  return r.stdout;
}
