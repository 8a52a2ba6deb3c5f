import express, { type Express } from 'express';
import path from 'node:path';
import fs from 'node:fs';
import { randomUUID } from 'node:crypto';
import helmet from 'helmet';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import cookieParser from 'cookie-parser';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import { doubleCsrf } from 'csrf-csrf';
import { pinoHttp } from 'pino-http';
import { pino } from 'pino';
import pg from 'pg';
import type { Config } from './config';
import { connectDatabase } from './db/connection';
import { keepPoolAlive } from './db/availability';
import { errorHandler, notFoundApi } from './middleware/error-handler';
import { requireSignIn } from './middleware/auth';
import { refuseUnsafeText } from './middleware/validate';
import { authRoutes } from './routes/auth';
import { staffRoutes } from './routes/staff';
import { athleteRoutes } from './routes/athletes';
import { injuryRoutes } from './routes/injuries';
import { runRoutes } from './routes/runs';
import { sequenceRoutes } from './routes/sequences';
import { noteRoutes } from './routes/notes';
import { reviewRoutes } from './routes/review';
import { findActiveSessionUser, verifyCredentials } from './services/auth-service';
import { startMail, type MailRuntime } from './mail/runtime';
import { createStorage } from './storage';
import { passwordRoutes } from './routes/password';
import { mailboxRoutes } from './routes/mailbox';
import { uploadRoutes } from './routes/uploads';
import { healthRoutes } from './routes/health';
import { settingsRoutes } from './routes/settings';
import { auditRoutes } from './routes/audit';
import { dataRightsRoutes } from './routes/data-rights';
import { optOutRoutes } from './routes/opt-out';
import type { SessionUser } from '../shared/auth/schemas';

export type AppHandle = { app: Express; pool: pg.Pool; mail: MailRuntime };

/** The middleware pipeline, top to bottom. Tests build it in-process against the real PostgreSQL. */
export function createApp(config: Config, options: { clientDist?: string } = {}): AppHandle {
  connectDatabase(config.databaseUrl);
  // One logger for the process: request lines, mail and database warnings all go through it.
  const logger = pino({ level: config.logLevel });
  const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 5 });
  keepPoolAlive(pool, logger);
  // E-mail (the outbox worker, and outside production a local SMTP server) and file storage live in this process.
  const mail = startMail(config, logger);
  const storage = createStorage(config.storage);

  const app = express();
  app.disable('x-powered-by');
  if (config.trustProxy) app.set('trust proxy', config.trustProxy);

  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const id = randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      // Health probes arrive every few seconds from the proxy: logging each would bury the real requests.
      autoLogging: config.env === 'test' ? false : { ignore: (req) => req.url === '/healthz' },
      // A line per request, without headers or cookies.
      serializers: {
        // Set-password links carry a token in the query: it never reaches the logs.
        req: (req) => ({ id: req.id, method: req.method, url: req.url?.replace(/([?&]token=)[^&]*/g, '$1[redacted]') }),
        res: (res) => ({ statusCode: res.statusCode }),
      },
    }),
  );

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          // Fonts, sounds and scripts are all bundled: nothing is fetched from elsewhere.
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'media-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          // Over plain HTTP on a clinic network this directive would blank the page.
          'upgrade-insecure-requests': config.secureCookies ? [] : null,
        },
      },
      strictTransportSecurity: config.secureCookies,
    }),
  );

  // Before sessions and CSRF: a probe carries no cookie and must not create a session.
  app.use(healthRoutes(pool));

  app.use(express.json({ limit: '200kb' }));
  app.use(refuseUnsafeText);
  app.use(cookieParser());

  const PgStore = connectPgSimple(session);
  app.use(
    session({
      name: 'mendstep.sid',
      store: new PgStore({ pool, tableName: 'session', pruneSessionInterval: config.env === 'test' ? false : 15 * 60 }),
      secret: config.sessionSecret,
      resave: false,
      saveUninitialized: false,
      // Each request pushes the expiry on: the cookie's age is the idle timeout.
      rolling: true,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.secureCookies,
        maxAge: config.sessionIdleMinutes * 60_000,
      },
    }),
  );

  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      verifyCredentials(email, password).then((user) => done(null, user ?? false), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, (user as SessionUser).id));
  passport.deserializeUser((id: string, done) => {
    findActiveSessionUser(id).then((user) => done(null, user ?? false), done);
  });
  app.use(passport.session());

  const { generateCsrfToken, doubleCsrfProtection } = doubleCsrf({
    getSecret: () => config.sessionSecret,
    getSessionIdentifier: (req) => req.session.id,
    cookieName: config.secureCookies ? '__Host-mendstep.csrf' : 'mendstep.csrf',
    cookieOptions: { sameSite: 'lax', secure: config.secureCookies, path: '/', httpOnly: true },
    getCsrfTokenFromRequest: (req) => req.get('x-csrf-token'),
  });

  const api = express.Router();
  api.use(doubleCsrfProtection);
  api.get('/health', (_req, res) => {
    // `mailbox` tells the client whether to offer the local mailbox (never in production).
    res.json({ ok: true, mailbox: config.env !== 'production' });
  });
  api.use('/auth', authRoutes(config, generateCsrfToken));
  api.use('/auth', passwordRoutes(config));
  api.use('/mailbox', mailboxRoutes(config));
  api.use('/opt-out', optOutRoutes(config));
  api.use(requireSignIn);
  api.use(uploadRoutes(storage));
  api.use(dataRightsRoutes(storage));
  api.use('/staff', staffRoutes());
  api.use('/athletes', athleteRoutes());
  api.use('/injuries', injuryRoutes());
  // Notes first: their routes carry their own role guards, and the runs router guards everything it sees.
  api.use('/runs', noteRoutes());
  api.use('/runs', runRoutes());
  api.use('/review', reviewRoutes());
  api.use('/sequences', sequenceRoutes());
  api.use('/settings', settingsRoutes());
  api.use('/audit', auditRoutes());
  api.use(notFoundApi);
  app.use('/api', api);

  const dist = options.clientDist ?? path.resolve(import.meta.dirname, '../dist');
  if (fs.existsSync(path.join(dist, 'index.html'))) {
    app.use(express.static(dist, { index: false, maxAge: '1h' }));
    // Client-side routes: every other GET gets the app shell.
    app.get('/{*splat}', (_req, res) => {
      // root + relative name: sendFile refuses paths through dot-folders such as .data/.
      res.sendFile('index.html', { root: dist });
    });
  }

  app.use(errorHandler);
  return { app, pool, mail };
}
