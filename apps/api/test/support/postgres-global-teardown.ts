/** Jest global teardown of jest.postgres.config.js: stops and removes the test cluster. */
export default async function teardown(): Promise<void> {
  (globalThis as { rotaplexPostgresCluster?: { stop(): void } }).rotaplexPostgresCluster?.stop();
}
