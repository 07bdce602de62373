// Starts the HTTP server with its mail worker and scheduler. Everything testable lives in
// createApp(). In development (no SMTP_URL / S3_ENDPOINT) the local fakes start in-process.
import path from 'node:path';
import type { Transporter } from 'nodemailer';
import { createApp } from './app';
import { loadConfig, type Config } from './config';
import { createDb } from './db';
import { createLogger } from './logger';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';
import { OutboxWorker } from './mail/outbox';
import { createTransport } from './mail/transport';
import { startScheduler } from './jobs/scheduler';
import { startFakeS3, type FakeS3 } from './storage/fake-s3';

export async function startServer(env: Record<string, string | undefined> = process.env) {
  const loaded = loadConfig(env);
  const logger = createLogger(loaded.logLevel);
  const local = loaded.env !== 'production';

  let fakeSmtp: FakeSmtp | undefined;
  let smtpUrl = loaded.mail.smtpUrl;
  if (!smtpUrl) {
    if (!local) throw new Error('SMTP_URL is required in production.');
    fakeSmtp = await startFakeSmtp({ port: loaded.mail.fakePort });
    smtpUrl = fakeSmtp.url;
  }
  let fakeS3: FakeS3 | undefined;
  let s3Endpoint = loaded.s3.endpoint;
  if (!s3Endpoint && local) {
    fakeS3 = await startFakeS3({ directory: path.resolve(__dirname, '..', '.data', `s3-${loaded.db.database}`), port: 0, bucket: loaded.s3.bucket });
    s3Endpoint = fakeS3.endpoint;
  }
  const config: Config = { ...loaded, s3: { ...loaded.s3, endpoint: s3Endpoint } };

  const db = createDb(config);
  const transport: Transporter = createTransport(smtpUrl);
  const worker = new OutboxWorker(db, transport, config.mail.from, logger, { leaseMs: config.mail.leaseMs });
  const app = createApp({ db, config, logger, mailbox: fakeSmtp });
  const scheduler = config.mail.scheduler
    ? startScheduler({ db, worker, publicUrl: config.publicUrl, cron: config.mail.cron, pollMs: config.mail.pollMs, logger })
    : undefined;

  const server = app.listen(config.port, config.host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', resolve);
    server.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  const close = async () => {
    scheduler?.stop();
    await new Promise<void>((resolve) => server.close(() => resolve()));
    transport.close();
    await fakeSmtp?.close();
    await fakeS3?.close();
    await db.destroy();
  };
  return { server, config, db, logger, port, close, worker, scheduler, fakeSmtp };
}

if (require.main === module) {
  // A lab server must outlive a database or mail outage: log stray rejections, never exit on them.
  process.on('unhandledRejection', (reason) => {
    console.error(JSON.stringify({ level: 'error', msg: 'unhandled rejection', reason: String(reason) }));
  });
  startServer()
    .then(({ config, port, close }) => {
      console.log(JSON.stringify({ msg: 'listening', url: `http://${config.host}:${port}`, port }));
      // Stopped by a supervisor (`npm run cluster`, systemd): finish the requests in flight first.
      process.once('SIGTERM', () => {
        close().finally(() => process.exit(0));
      });
    })
    .catch((error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    });
}
