import type { TestProject } from 'vitest/node';
import { freshDatabase, throwawayCluster } from './database';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
    baseUrl: string;
  }
}

/** Global setup of the API tests: a freshly migrated database `lw_api` on the throwaway cluster. */
export default async function setup(project: TestProject): Promise<() => void> {
  const cluster = await throwawayCluster();
  const url = await freshDatabase(cluster.adminUrl, 'lw_api');
  project.provide('databaseUrl', url);
  return cluster.stop;
}
