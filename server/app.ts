import fs from 'node:fs';
import path from 'node:path';
import express from 'express';
import session from 'express-session';
import helmet from 'helmet';
import pg from 'pg';
import { pino } from 'pino';
import type { AppDeps, Deps } from './deps';
import { createStorage } from './storage';
import { useMailSealSecret } from './mail/seal';
import { AnswerCache } from './cache/answer-cache';
import { requireCsrf } from './middleware/csrf';
import { requestLog } from './middleware/request-log';
import { createSessionStore } from './middleware/session-store';
import { LOG_REDACT_PATHS, refreshSession } from './middleware/session';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { applicationsRouter, applyRouter, clubWaitlistRouter } from './routes/applications';
import { mailingsRouter, mailPreferencesRouter } from './routes/mailings';
import { mailStopsRouter } from './routes/mail-stops';
import { mailTemplatesRouter } from './routes/mail-templates';
import { clubExportsRouter } from './routes/exports';
import { memberImportsRouter } from './routes/member-imports';
import { waitlistImportsRouter } from './routes/waitlist-imports';
import { clubsRouter } from './routes/clubs';
import { clubSignupsRouter } from './routes/club-signups';
import { cropsRouter } from './routes/crops';
import { clubFeesRouter, feesRouter, myFeesRouter } from './routes/fees';
import { clubInvitesRouter, inviteLinksRouter } from './routes/invites';
import { harvestFiguresRouter } from './routes/harvest-figures';
import { seasonSummaryRouter } from './routes/season-summary';
import { membersRouter } from './routes/members';
import { myPlotRouter } from './routes/my-plot';
import { passwordResetsRouter } from './routes/password-resets';
import { findingsRouter } from './routes/findings';
import { tasksRouter } from './routes/tasks';
import { plotBookRouter } from './routes/plot-book';
import { plotImportsRouter } from './routes/plot-imports';
import { offersRouter } from './routes/offers';
import { outboxRouter } from './routes/outbox';
import { plotsRouter } from './routes/plots';
import { renewalsRouter } from './routes/renewals';
import { clubSeasonsRouter, seasonsRouter } from './routes/seasons';
import { siteBackgroundsRouter } from './routes/site-backgrounds';
import { clubSitesRouter, sitesRouter } from './routes/sites';
import { sessionRouter } from './routes/session';
import { shiftsRouter } from './routes/shifts';
import { weatherRouter } from './routes/weather';

export interface BuiltApp {
  app: express.Express;
  /** Closes what the app opened itself (the session store's pool). */
  close(): Promise<void>;
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(input: AppDeps): BuiltApp {
  const answers = new AnswerCache(32 * 1024 * 1024);
  const { config } = input;
  const deps: Deps = { ...input, storage: input.storage ?? createStorage(config) };
  // The outbox seals mail bodies under a key derived from the session secret (server/mail/seal.ts).
  useMailSealSecret(config.sessionSecret);
  const app = express();
  app.disable('x-powered-by');
  if (config.trustProxy) app.set('trust proxy', 1);

  const logger = pino(
    {
      level: config.logLevel,
      // A second guard beside the serializers: whatever reaches a log line under these paths is dropped.
      redact: { paths: LOG_REDACT_PATHS, remove: true },
    },
    deps.logDestination ?? pino.destination(1),
  );
  app.use(requestLog(logger));
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:'],
          // No inline <style> and no style="" in markup: stylesheets come from our own origin. React's
          // style props go through the CSSOM, which CSP does not govern (CSP Level 3, §6.1.3 style-src).
          'style-src': ["'self'"],
          // The offline shell's service worker (/sw.js) comes from our own origin and nowhere else.
          'worker-src': ["'self'"],
          'upgrade-insecure-requests': config.cookieSecure ? [] : null,
        },
      },
      strictTransportSecurity: config.cookieSecure,
    }),
  );
  app.use(express.json({ limit: '3mb' })); // plot CSV imports come as JSON, up to 2 MB of text

  const sessionPool = new pg.Pool({ connectionString: config.databaseUrl, max: 10 });
  // An idle client whose server went away emits 'error' on the pool; unheard, it ends the
  // process. The pool drops that client and connects afresh on the next request.
  sessionPool.on('error', (err) => logger.warn({ reason: err.message }, 'session store lost its database connection'));
  app.use(
    session({
      name: 'tillwell.sid',
      store: createSessionStore({
        pool: sessionPool,
        errorLog: (...args: unknown[]) => logger.warn({ reason: String(args[0]) }, 'session store error'),
      }),
      secret: config.sessionSecret,
      resave: false,
      // Nothing is stored for anonymous visitors: their CSRF token lives in a signed cookie.
      saveUninitialized: false,
      rolling: false,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.cookieSecure,
        maxAge: 14 * 24 * 60 * 60 * 1000,
      },
    }),
  );
  app.use(refreshSession);

  // API answers hold people's data and CSRF tokens: no cache keeps them unless a route says otherwise
  // (photos, backgrounds and calendar feeds set their own private caching).
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  // Stop links of optional mail: the token is the key, and mail providers' one-click POST carries no CSRF token.
  app.use('/api/mail-stops', mailStopsRouter(deps));
  app.use('/api', requireCsrf(config.sessionSecret));
  // The reads every page of the map and the boards make, reused per person while the database is unchanged.
  app.get(
    [
      '/api/sites/:siteId/plots',
      '/api/sites/:siteId/neighbours',
      '/api/sites/:siteId/findings',
      '/api/seasons/:seasonId/plot-states',
      '/api/clubs/:clubId/findings',
      '/api/clubs/:clubId/shifts',
      '/api/clubs/:clubId/my-plot',
      '/api/clubs/:clubId/season-summary',
    ],
    answers.middleware(),
  );
  app.use('/api/session', sessionRouter(deps));
  app.use('/api/password-resets', passwordResetsRouter(deps));
  app.use('/api/invites', inviteLinksRouter(deps));
  app.use('/api/club-signups', clubSignupsRouter(deps));
  app.use('/api/clubs/:clubId/invites', clubInvitesRouter(deps));
  app.use('/api/clubs/:clubId/members', membersRouter(deps));
  app.use('/api/clubs/:clubId/sites', clubSitesRouter(deps));
  app.use('/api/sites', sitesRouter(deps));
  app.use('/api/sites/:siteId/plot-imports', plotImportsRouter(deps));
  app.use('/api/sites/:siteId/background', siteBackgroundsRouter(deps));
  app.use('/api/plots', plotsRouter(deps));
  app.use('/api/apply', applyRouter(deps));
  app.use('/api/clubs/:clubId/waitlist', clubWaitlistRouter(deps));
  app.use('/api/applications', applicationsRouter(deps));
  app.use('/api/clubs/:clubId/member-imports', memberImportsRouter(deps));
  app.use('/api/clubs/:clubId/waitlist-imports', waitlistImportsRouter(deps));
  app.use('/api/clubs/:clubId/exports', clubExportsRouter(deps));
  app.use('/api/clubs/:clubId/mailings', mailingsRouter(deps));
  app.use('/api/clubs/:clubId/mail-preferences', mailPreferencesRouter(deps));
  app.use('/api/clubs/:clubId/outbox', outboxRouter(deps));
  app.use('/api/clubs/:clubId/mail-templates', mailTemplatesRouter(deps));
  app.use('/api/clubs/:clubId/my-plot', myPlotRouter(deps));
  app.use('/api/clubs/:clubId/crops', cropsRouter(deps));
  app.use('/api/clubs/:clubId/harvest-figures', harvestFiguresRouter(deps));
  app.use('/api/clubs/:clubId/season-summary', seasonSummaryRouter(deps));
  app.use('/api/clubs/:clubId/seasons', clubSeasonsRouter(deps));
  app.use('/api/seasons', seasonsRouter(deps));
  app.use('/api/offers', offersRouter(deps));
  app.use('/api/renewals', renewalsRouter(deps));
  app.use('/api/clubs/:clubId', clubsRouter(deps));
  app.use('/api/clubs/:clubId', clubFeesRouter(deps));
  app.use('/api/fees', feesRouter(deps));
  app.use('/api/me/fees', myFeesRouter(deps));
  // Plot books: /api/plots/:plotId/book, /api/plantings, /api/harvests, /api/observations, /api/observation-photos.
  app.use('/api', findingsRouter(deps));
  app.use('/api', tasksRouter(deps));
  app.use('/api', plotBookRouter(deps));
  // The weather log: /api/sites/:siteId/weather…, /api/sites/:siteId/weather-imports, /api/clubs/:clubId/weather-sites.
  app.use('/api', weatherRouter(deps));
  app.use('/api', shiftsRouter(deps));
  app.use('/api', apiNotFound);

  const indexHtml = path.join(config.staticDir, 'index.html');
  if (fs.existsSync(indexHtml)) {
    // The service worker must be looked at afresh on every visit, or a new build's shell waits a day (and an
    // hour of our own cache) behind the old one.
    app.get('/sw.js', (_req, res) => {
      res.set('Cache-Control', 'no-cache');
      res.sendFile(path.join(config.staticDir, 'sw.js'));
    });
    app.use(express.static(config.staticDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(indexHtml));
  }

  app.use(errorHandler);

  return {
    app,
    async close() {
      await sessionPool.end();
    },
  };
}
