import type { TestProject } from 'vitest/node';
import { startPostgresCluster } from './postgres';

declare module 'vitest' {
  export interface ProvidedContext {
    /** The throwaway cluster's superuser address (project api-pg only). */
    postgresAdminUrl: string;
  }
}

/** Starts one throwaway PostgreSQL cluster for the api-pg project; every test context makes its own database on it. */
export default async function setup(project: TestProject) {
  const cluster = await startPostgresCluster();
  project.provide('postgresAdminUrl', cluster.adminUrl);
  return () => cluster.stop();
}
