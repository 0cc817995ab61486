import 'reflect-metadata';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { createPool, type Pool } from 'mysql2/promise';
import type { DataSource } from 'typeorm';
import type { Config } from './config';
import { auditRouter } from './components/audit/api/audit-router';
import { AuditRepository } from './components/audit/data/audit-repository';
import { authRouter } from './components/auth/api/auth-router';
import { AuthService } from './components/auth/domain/auth-service';
import { healthRouter } from './components/health/api/health-router';
import { outboxRouter } from './components/outbox/api/outbox-router';
import { sitesRouter } from './components/sites/api/sites-router';
import { SitesRepository } from './components/sites/data/sites-repository';
import { SitesService } from './components/sites/domain/sites-service';
import { usersRouter } from './components/users/api/users-router';
import { createIngest } from './components/uploads/ingest-module';
import { createWatch, type Watch } from './components/watch/watch-module';
import { createPortfolio } from './components/portfolio/portfolio-module';
import { MailQueue } from './components/mail/domain/mail-queue';
import { budgetsRouter } from './components/budgets/api/budgets-router';
import { createReports } from './components/reports/reports-module';
import { BudgetsService } from './components/budgets/domain/budgets-service';
import { hydrozonesRouter } from './components/hydrozones/api/hydrozones-router';
import { HydrozonesRepository } from './components/hydrozones/data/hydrozones-repository';
import { HydrozonesService } from './components/hydrozones/domain/hydrozones-service';
import { organisationRouter } from './components/organisations/api/organisation-router';
import { OrganisationsRepository } from './components/organisations/data/organisations-repository';
import { OrganisationSettingsService } from './components/organisations/domain/organisation-settings-service';
import { rateSchedulesRouter } from './components/rates/api/rate-schedules-router';
import { RateSchedulesRepository } from './components/rates/data/rate-schedules-repository';
import { RateSchedulesService } from './components/rates/domain/rate-schedules-service';
import { siteWeatherStationRouter, weatherStationsRouter } from './components/weather/api/weather-stations-router';
import { WeatherFeedClient } from './components/weather/data/weather-feed-client';
import { WeatherRepository } from './components/weather/data/weather-repository';
import { DailyWeatherService } from './components/weather/domain/daily-weather-service';
import { WeatherStationsService } from './components/weather/domain/weather-stations-service';
import { UsersRepository } from './components/users/data/users-repository';
import { UsersService } from './components/users/domain/users-service';
import { createCsrf } from './platform/auth/csrf';
import { requireSignedIn } from './platform/auth/guards';
import { MariaDbRateLimitStore } from './platform/auth/mariadb-rate-limit-store';
import { createPassport } from './platform/auth/passport';
import { createSessionMiddleware } from './platform/auth/session';
import { errorHandler, notFoundHandler } from './platform/error-handler';
import type { Mailer } from './platform/mail/mailer';

export const VERSION = '0.1.0';

export interface AppDeps {
  config: Config;
  db: DataSource;
  mailer: Mailer;
}

export interface App {
  app: Express;
  /** Closes what the app opened (session store, its pool); the caller owns `db` and `mailer`. */
  close(): Promise<void>;
  /** What the scheduled jobs need. */
  mailQueue: MailQueue;
  /** The nightly watch (its scheduled job and run function). */
  watch: Watch;
}

/** The composition root: builds repositories, services and routers over one DataSource. */
export function createApp({ config, db, mailer }: AppDeps): App {
  // A small mysql2 pool for the session and rate-limit stores (TypeORM keeps its own pool).
  const pool: Pool = createPool({
    host: config.db.host,
    port: config.db.port,
    user: config.db.user,
    password: config.db.password,
    database: config.db.database,
    connectionLimit: 5,
    timezone: 'Z',
  });

  const audit = new AuditRepository(db);
  const usersRepository = new UsersRepository(db);
  const auth = new AuthService(db, usersRepository, audit);
  const mailQueue = new MailQueue(db, mailer);
  const users = new UsersService(db, usersRepository, audit, mailQueue, config);
  const sites = new SitesService(db, new SitesRepository(db), audit);
  const ingest = createIngest({ db, config, sites, auth, audit });
  const organisationSettings = new OrganisationSettingsService(db, new OrganisationsRepository(db), audit);
  const hydrozones = new HydrozonesService(db, new HydrozonesRepository(db), sites, audit);
  const weatherRepository = new WeatherRepository(db);
  const weatherStations = new WeatherStationsService(db, weatherRepository, sites, audit);
  const dailyWeather = new DailyWeatherService(
    db,
    weatherRepository,
    weatherStations,
    new WeatherFeedClient(config.weather.feedUrl, config.weather.feedTimeoutMs),
    audit,
  );
  const rateSchedules = new RateSchedulesService(db, new RateSchedulesRepository(db), sites, audit);
  const budgets = new BudgetsService(
    sites,
    hydrozones,
    weatherStations,
    dailyWeather,
    rateSchedules,
    organisationSettings,
  );
  const watch = createWatch({ db, config, sites, budgets, rates: rateSchedules, mailQueue, audit });
  const reports = createReports({
    db,
    sites,
    budgets,
    weatherStations,
    dailyWeather,
    rateSchedules,
    audit,
    mailQueue,
    publicUrl: config.http.publicUrl,
  });
  const dashboard = createPortfolio({ db, sites, budgets, rates: rateSchedules });

  const passport = createPassport(auth);
  const session = createSessionMiddleware(config, pool);
  const csrf = createCsrf(config);
  const rateLimitStore = new MariaDbRateLimitStore(pool, 'sign-in');
  // Expired sign-in counters are dropped now and then so the table stays small.
  const pruneTimer = setInterval(() => void rateLimitStore.prune().catch(() => undefined), 15 * 60_000);
  pruneTimer.unref();

  const app = express();
  app.set('trust proxy', config.http.trustProxy);
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          // Angular Material sets inline styles; scripts stay same-origin only.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          frameSrc: ["'self'"],
          upgradeInsecureRequests: config.session.secureCookies ? [] : null,
        },
      },
      hsts: config.session.secureCookies,
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(cookieParser());
  api.use('/health', healthRouter(db, VERSION));
  api.use(session.middleware);
  api.use(passport.session());
  api.use(csrf.protect, csrf.toAppError);
  api.use('/auth', authRouter({ auth, passport, csrf, rateLimitStore, config }));
  api.use(ingest.apiKeyAuth);
  api.use(requireSignedIn);
  api.use('/sites', sitesRouter(sites));
  api.use('/sites/:id/hydrozones', hydrozonesRouter(hydrozones));
  api.use('/sites/:id/weather-station', siteWeatherStationRouter(weatherStations));
  api.use('/sites/:id/rate-schedules', rateSchedulesRouter(rateSchedules));
  api.use('/sites/:id', budgetsRouter(budgets));
  api.use('/sites/:id', dashboard.siteDashboardRouter);
  api.use('/portfolio', dashboard.portfolioRouter);
  api.use('/weather-stations', weatherStationsRouter(weatherStations, dailyWeather));
  api.use('/organisation', organisationRouter(organisationSettings));
  api.use('/users', usersRouter(users));
  api.use('/audit', auditRouter(audit));
  api.use(reports.router);
  api.use(ingest.router);
  api.use(watch.router);
  if (config.mail.devOutbox) api.use('/dev/outbox', outboxRouter(config));
  api.use(notFoundHandler);
  app.use('/api', api);

  serveWebApp(app, config);
  app.use(errorHandler);

  return {
    app,
    mailQueue,
    watch,
    async close() {
      clearInterval(pruneTimer);
      await session.close();
      await pool.end();
    },
  };
}

/** In production one server serves the built Angular app too; unknown paths get index.html (client routing). */
function serveWebApp(app: Express, config: Config): void {
  const dir = resolve(config.http.webDir);
  if (!existsSync(resolve(dir, 'index.html'))) return;
  app.use(
    express.static(dir, {
      index: false,
      maxAge: '1h',
      setHeaders: (res, path) => {
        if (/-[A-Z0-9]{8}\.(js|css)$/.test(path)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
      },
    }),
  );
  app.get('/{*splat}', (_req, res) => res.sendFile(resolve(dir, 'index.html')));
}
