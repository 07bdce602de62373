// The app factory: tests import createApp() and drive it with supertest; index.ts only listens.
import compression from 'compression';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { createPassport } from './auth/passport';
import { SessionStore } from './auth/session-store';
import type { Config } from './config';
import type { Db } from './db';
import { createThrottles } from './auth/throttle';
import { createCsrf } from './middleware/csrf';
import type { Mailbox } from './mail/fake-smtp';
import { invitationsRouter, passwordResetsRouter } from './routes/accounts';
import { auditRouter } from './routes/audit';
import { benchRunsRouter } from './routes/bench-runs';
import { assessmentsRouter, bookingsRouter } from './routes/bookings';
import { calcRouter } from './routes/calc';
import { checklistTemplatesRouter } from './routes/checklist-templates';
import { labRulesRouter } from './routes/lab-rules';
import { mailboxRouter } from './routes/mailbox';
import { reportsRouter } from './routes/reports';
import { filesRouter } from './routes/files';
import { itemsRouter } from './routes/items';
import { labelsRouter } from './routes/labels';
import { createObjectStore, type ObjectStore } from './storage/object-store';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { requestLog } from './middleware/request-log';
import { noStore } from './middleware/no-store';
import { serverTiming } from './middleware/server-timing';
import { healthRouter } from './routes/health';
import { incidentsRouter } from './routes/incidents';
import { calendarFeedRouter, calendarFileRouter } from './routes/calendar-feed';
import { groupsRouter, peopleRouter, qualificationsRouter } from './routes/people';
import { sessionRouter } from './routes/session';
import { webRouter } from './web';

export interface AppDeps {
  db: Db;
  config: Config;
  logger: Logger;
  /** Defaults to the S3 bucket named in the configuration. */
  objectStore?: ObjectStore;
  /** The local fake SMTP server's mailbox, when it is in use (development, tests). */
  mailbox?: Mailbox;
  /**
   * Routes to mount behind the security headers, request log and body parser but ahead of the
   * session: the bench's reference route, so it differs from a signed-in read only by session work.
   */
  mountBeforeSession?: (app: Express) => void;
}

export function createApp({ db, config, logger, objectStore, mailbox, mountBeforeSession }: AppDeps): Express {
  const app = express();
  const store = objectStore ?? createObjectStore(config);
  app.disable('x-powered-by');
  // API answers are never cached (no-store below), so an ETag would only cost a SHA-1 of every
  // body. The web app's own files get theirs from the static file server, which ignores this.
  app.set('etag', false);
  if (config.trustProxy) app.set('trust proxy', 1);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          // The QR decoder compiles WebAssembly; nothing else is evaluated.
          'script-src': ["'self'", "'wasm-unsafe-eval'"],
          // react-native-web injects its style rules at run time into a <style> element.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'media-src': ["'self'", 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'worker-src': ["'self'", 'blob:'],
          'object-src': ["'none'"],
          'frame-ancestors': ["'none'"],
          'upgrade-insecure-requests': config.session.secureCookies ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  // API answers over 1 KB (lists, a booking) go out gzip/brotli-compressed; the web app's files
  // are compressed at build time instead (server/web.ts).
  app.use('/api', compression({ threshold: 1024 }));
  // Server-Timing tells a visitor how long the server worked on an answer; not in production.
  app.use('/api', requestLog(logger), ...(config.env === 'production' ? [] : [serverTiming]), noStore);
  app.use('/api/health', healthRouter(db));

  const passport = createPassport(db);
  const csrf = createCsrf(config.session);
  const throttles = createThrottles(db, config);
  app.use('/api', express.json({ limit: '100kb' }), cookieParser());
  mountBeforeSession?.(app);
  app.use(
    '/api',
    session({
      name: 'voltcrib.sid',
      secret: config.session.secret,
      store: new SessionStore(db, config.session.cacheMs),
      resave: false,
      // No row until there is something to keep (a sign-in): anonymous visitors' CSRF tokens
      // live in a signed cookie instead (middleware/csrf.ts).
      saveUninitialized: false,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.session.secureCookies,
        maxAge: config.session.maxAgeMs,
      },
    }),
  );
  app.use('/api', passport.session());
  app.use('/api', csrf.protection);

  app.use('/api/session', sessionRouter(db, passport, csrf, throttles.signIn));
  app.use('/api/people', peopleRouter(db, config));
  app.use('/api/groups', groupsRouter(db));
  app.use('/api/qualifications', qualificationsRouter(db));
  app.use('/api/calc', calcRouter());
  app.use('/api/items', itemsRouter(db, config, store));
  app.use('/api/files', filesRouter(db, store));
  app.use('/api', labelsRouter(db, config));
  app.use('/api/assessments', assessmentsRouter(db));
  app.use('/api/bookings', bookingsRouter(db, config, store));
  app.use('/api/bookings', benchRunsRouter(db, config));
  app.use('/api/lab-rules', labRulesRouter(db));
  app.use('/api/checklist-templates', checklistTemplatesRouter(db));
  app.use('/api/audit', auditRouter(db));
  app.use('/api/invitations', invitationsRouter(db, config, throttles.invitation));
  app.use('/api/password-resets', passwordResetsRouter(db, config, throttles.passwordReset));
  // The local fake SMTP's messages: only when it is in use, and never in production.
  app.use('/api/mailbox', mailboxRouter(config.env === 'production' ? undefined : mailbox));
  app.use('/api/reports', reportsRouter(db));
  app.use('/api/incidents', incidentsRouter(db, config, store));
  app.use('/api/calendar-feed', calendarFeedRouter(db, config));

  app.use('/api', apiNotFound);
  app.use('/cal', calendarFileRouter(db, config));
  app.use(webRouter(config.webDir));
  app.use(errorHandler(logger));
  return app;
}
