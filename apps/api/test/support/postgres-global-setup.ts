import { startPostgresCluster, TEST_CLUSTER_ENV } from '../../src/database/postgres-cluster';

/**
 * Jest global setup of jest.postgres.config.js: one throwaway PostgreSQL 15 cluster for the run;
 * every startTestApp() creates its own database in it. The teardown stops and removes it.
 */
export default async function setup(): Promise<void> {
  const cluster = await startPostgresCluster();
  process.env['ROTAPLEX_TEST_DATABASE'] = 'postgres';
  process.env[TEST_CLUSTER_ENV.dir] = cluster.dir;
  process.env[TEST_CLUSTER_ENV.port] = String(cluster.port);
  (globalThis as { rotaplexPostgresCluster?: { stop(): void } }).rotaplexPostgresCluster = cluster;
}
