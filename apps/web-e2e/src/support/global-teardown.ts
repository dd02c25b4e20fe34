import { stopServer } from './server';

export default async function globalTeardown(): Promise<void> {
  const server = globalThis.__ROTAPLEX_SERVER__;
  if (server) await stopServer(server);
  globalThis.__ROTAPLEX_SERVER__ = undefined;
}
