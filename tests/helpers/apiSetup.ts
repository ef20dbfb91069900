import type { TestProject } from 'vitest/node';
import { freshDatabase, throwawayCluster } from './database';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The throwaway cluster's admin URL (to create and drop databases). */
    pgAdminUrl: string;
    /** The migrated database the API test files are copied from (tests/helpers/apiEnv.ts). */
    apiTemplate: string;
    /** The migrated and seeded database each browser test file's server is copied from (tests/helpers/e2eServer.ts). */
    e2eTemplate: string;
    /** The client built once for the browser tests. */
    e2eClientDist: string;
  }
}

/** The template every API test file gets its own copy of. */
export const API_TEMPLATE = 'lw_api';

/**
 * Global setup of the API tests: database `lw_api` on the throwaway cluster, migrated once. It is only a template:
 * each test file runs on its own copy of it (tests/helpers/apiEnv.ts), so no file sees another file's rows.
 */
export default async function setup(project: TestProject): Promise<() => void> {
  const cluster = await throwawayCluster();
  await freshDatabase(cluster.adminUrl, API_TEMPLATE);
  project.provide('pgAdminUrl', cluster.adminUrl);
  project.provide('apiTemplate', API_TEMPLATE);
  return cluster.stop;
}
