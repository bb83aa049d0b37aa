import compression from 'compression';
import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { authRouter, createPassport, defaultSignInLimits, type SignInLimits } from './auth/auth-router';
import { AuthService } from './auth/auth-service';
import { KnexSessionStore } from './auth/session-store';
import type { Config } from './config';
import { healthRouter } from './health/health-router';
import { loadStudio, requireAuth } from './http/auth-middleware';
import { calendarEngineRouter } from './events/calendar-engine-router';
import { csrf } from './http/csrf';
import { requestLog } from './http/request-log';
import { apiNotFound, errorMiddleware } from './http/error-middleware';
import { ImportService } from './imports/import-service';
import { importsRouter } from './imports/imports-router';
import { StudioService } from './studios/studio-service';
import { studiosRouter } from './studios/studios-router';
import { trendsRoutes } from './series/trends-routes';
import { accountRouter, passwordResetRouter } from './account/account-router';
import { AccountService } from './account/account-service';
import { mailboxRouter } from './dev/mailbox-router';
import { Mailer } from './mail/mailer';
import { invitationRouter, teamRouter } from './team/team-router';
import { TeamService } from './team/team-service';
import { feedFileRouter, feedsRouter } from './feeds/feeds-router';
import { FeedService } from './feeds/feed-service';
import { agendaRouter } from './agenda/agenda-router';
import { AgendaScheduler } from './agenda/agenda-scheduler';

export interface AppDeps {
  config: Config;
  db: Knex;
  log: Logger;
  signInLimits?: SignInLimits;
}

export function createApp({ config, db, log, signInLimits }: AppDeps): Express {
  const app = express();
  const isSecure = config.publicUrl.startsWith('https://');
  app.disable('x-powered-by');
  if (config.TRUST_PROXY !== false) app.set('trust proxy', config.TRUST_PROXY);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          upgradeInsecureRequests: isSecure ? [] : null,
        },
      },
      hsts: isSecure,
    }),
  );
  app.use(requestLog(log));
  // Text answers (scripts, styles, JSON, feeds) compressed, brotli where the browser takes it.
  app.use(compression());
  app.use(cookieParser());
  app.use(express.json({ limit: '200kb' }));

  // Health answers before sessions are loaded, so a signed-in probe still says "db down" instead of failing.
  app.use('/api/health', csrf(config.SESSION_SECRET, isSecure), healthRouter(db));
  const store = new KnexSessionStore(db);
  app.use(
    '/api',
    session({
      name: 'kerfcast.sid',
      secret: config.SESSION_SECRET,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      // 'auto': Secure whenever the request came over TLS (directly or through a trusted proxy).
      cookie: { httpOnly: true, sameSite: 'lax', secure: isSecure || 'auto', maxAge: 14 * 24 * 3600 * 1000 },
    }),
  );
  const mailer = new Mailer(config);
  const auth = new AuthService(db, { mailer, publicUrl: config.publicUrl, log });
  const passport = createPassport(auth);
  app.use('/api', passport.initialize(), passport.session());
  app.use('/api', csrf(config.SESSION_SECRET, isSecure));

  app.use(
    '/api/auth',
    authRouter(auth, passport, signInLimits ?? defaultSignInLimits),
  );
  const team = new TeamService(db, mailer, config.publicUrl);
  const accounts = new AccountService(db, mailer, config.publicUrl, log);
  app.use('/api/auth/password-reset', passwordResetRouter(accounts));
  app.use('/api/account', accountRouter(accounts));
  app.use('/api/invitations', invitationRouter(team));
  if (config.NODE_ENV !== 'production') app.use('/api/dev/mailbox', mailboxRouter(db));
  const studio = Router();
  app.use('/api/studios/:studioId', requireAuth, loadStudio(db), studio);
  studio.use('/', studiosRouter(new StudioService(db)));
  // Scores are recomputed after every import commit or deletion (issue 4).
  const trends = trendsRoutes(db);
  studio.use('/imports', importsRouter(new ImportService(db, { afterSeriesChanged: trends.scoring.afterSeriesChanged, log }), { limitMb: config.UPLOAD_LIMIT_MB }));
  studio.use('/', trends.router);
  studio.use('/', calendarEngineRouter(db));
  studio.use('/', teamRouter(team));
  const feeds = new FeedService(db, config.publicUrl);
  studio.use('/feeds', feedsRouter(feeds));
  studio.use('/agenda', agendaRouter(new AgendaScheduler(db, mailer, config.publicUrl, log)));
  app.use('/api', apiNotFound);

  app.use('/feeds', feedFileRouter(feeds));
  serveClient(app, config);
  app.use(errorMiddleware(log));
  return app;
}

function Router() {
  return express.Router({ mergeParams: true });
}

// The built Angular app, with index.html for every client-side route.
/** A built script or stylesheet whose name carries its content hash: main-5QXYZ7AB.js, styles-ABCD1234.css. */
export const HASHED_FILE = /-[A-Z0-9]{8}\.(js|css)$/;

function serveClient(app: Express, config: Config): void {
  const dist = path.resolve(config.CLIENT_DIST);
  const index = path.join(dist, 'index.html');
  if (!fs.existsSync(index)) return;
  app.use(
    express.static(dist, {
      index: false,
      maxAge: '1h',
      // Scripts and styles carry a content hash in their names (outputHashing "bundles"): a changed
      // file is a new name, so a browser may keep each one for a year without asking again.
      setHeaders: (res, file) => {
        if (HASHED_FILE.test(path.basename(file))) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
      },
    }),
  );
  app.get(/^\/(?!api\/|feeds\/).*/, (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
