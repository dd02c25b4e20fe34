import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { createServer } from 'node:net';
import { createApp } from './app';
import { type AppConfig, ConfigValidationError, loadConfig, resolveJwtSecret } from './config/app-config';
import { loadScaleOutConfig, type ScaleOutConfig } from './redis/scale-out-config';

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

async function main(): Promise<void> {
  // Whatever the server creates (data directory, database files, generated JWT secret) is private
  // to the account it runs as; the database layer sets the modes explicitly as well.
  process.umask(0o077);
  let config: AppConfig;
  let scaleOut: ScaleOutConfig;
  try {
    config = resolveJwtSecret(loadConfig(process.env));
    scaleOut = loadScaleOutConfig(process.env);
  } catch (err) {
    if (err instanceof ConfigValidationError) {
      console.error(`Rotaplex cannot start.\n${err.message}`);
      process.exit(1);
    }
    throw err;
  }
  if (config.port === 0) {
    // PORT=0: pick a free port up front so e-mail links (PUBLIC_URL) carry the real one.
    const port = await freePort();
    config = { ...config, port, publicUrl: config.publicUrl ?? `http://localhost:${port}` };
  }
  const app = await createApp(config, { scaleOut });
  await app.listen(config.port);
  new Logger('Rotaplex').log(
    `Rotaplex ${config.version} (${config.nodeEnv}) listening on ${config.publicUrl}`,
  );
}

main().catch((err: unknown) => {
  console.error('Rotaplex failed to start:', err instanceof Error ? err.message : err);
  if (err instanceof Error && err.stack) console.error(err.stack);
  process.exit(1);
});
