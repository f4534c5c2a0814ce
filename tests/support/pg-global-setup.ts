// Starts one throwaway PostgreSQL cluster for the integration suite's
// PostgreSQL run; each test file then makes its own database on it.
import type { TestProject } from 'vitest/node';
import { startPgCluster } from './pg-cluster';

declare module 'vitest' {
  export interface ProvidedContext {
    pgAdminUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const cluster = await startPgCluster();
  project.provide('pgAdminUrl', cluster.adminUrl);
  return () => cluster.stop();
}
