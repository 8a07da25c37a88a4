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
  // an interrupted run (Ctrl-C) skips the teardown; stop is synchronous, so it can run at exit
  process.once('exit', () => cluster.stop());
  return () => cluster.stop();
}
