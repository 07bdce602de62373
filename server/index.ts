// Starts the HTTP server. Everything testable lives in createApp().
import { createApp } from './app';
import { loadConfig } from './config';
import { createDb } from './db';
import { createLogger } from './logger';

export async function startServer(env: Record<string, string | undefined> = process.env) {
  const config = loadConfig(env);
  const logger = createLogger(config.logLevel);
  const db = createDb(config);
  const app = createApp({ db, config, logger });
  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  const close = async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await db.destroy();
  };
  return { server, config, db, logger, port, close };
}

if (require.main === module) {
  startServer()
    .then(({ config, port }) => console.log(`Voltcrib API and web app on http://${config.host}:${port}`))
    .catch((error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    });
}
