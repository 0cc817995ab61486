import 'reflect-metadata';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { createPool, type Pool } from 'mysql2/promise';
import type { DataSource } from 'typeorm';
import type { Config } from './config';
import { createAlerts } from './components/alerts/alerts-module';
import { createApiKeys } from './components/api-keys/api-keys-module';
import { createAudit } from './components/audit/audit-module';
import { createAuth } from './components/auth/auth-module';
import { createBudgets } from './components/budgets/budgets-module';
import { createEtaf } from './components/etaf/etaf-module';
import { createFieldAudits } from './components/field-audits/field-audits-module';
import { createHealth } from './components/health/health-module';
import { createHydrozones } from './components/hydrozones/hydrozones-module';
import { createMail } from './components/mail/mail-module';
import type { MailQueue } from './components/mail/domain/mail-queue';
import { createMeters } from './components/meters/meters-module';
import { createMonthClose } from './components/month-close/month-close-module';
import { createOrganisations } from './components/organisations/organisations-module';
import { createOutbox } from './components/outbox/outbox-module';
import { createPlanner } from './components/planner/planner-module';
import { createPortfolio } from './components/portfolio/portfolio-module';
import { createRates } from './components/rates/rates-module';
import { createReadings } from './components/readings/readings-module';
import { createReports } from './components/reports/reports-module';
import { createSavings } from './components/savings/savings-module';
import { createSites } from './components/sites/sites-module';
import { createUploads } from './components/uploads/uploads-module';
import { createUsers } from './components/users/users-module';
import { createWatch, type Watch } from './components/watch/watch-module';
import { createWateringRules } from './components/watering-rules/watering-rules-module';
import { createWeather } from './components/weather/weather-module';
import { createCsrf } from './platform/auth/csrf';
import { requireSignedIn } from './platform/auth/guards';
import { DatabaseWatch } from './db/database-watch';
import { databaseGate } from './platform/database-gate';
import { createSessionMiddleware } from './platform/auth/session';
import { errorHandler, notFoundHandler } from './platform/error-handler';
import type { Mailer } from './platform/mail/mailer';
import { LocalFileStore } from './platform/storage/local-file-store';

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

/** The composition root: each component's module over one DataSource, then the HTTP pipeline. */
export function createApp({ config, db, mailer }: AppDeps): App {
  // A small mysql2 pool for the session store (TypeORM keeps its own pool).
  const pool: Pool = createPool({
    host: config.db.host,
    port: config.db.port,
    user: config.db.user,
    password: config.db.password,
    database: config.db.database,
    connectionLimit: 5,
    timezone: 'Z',
  });

  // Knows within about two seconds when MariaDB stops answering (readiness, and 503s instead of waiting).
  const databaseWatch = new DatabaseWatch(config.db);
  databaseWatch.start();
  const csrf = createCsrf(config);

  // Each component wires its own repositories, services and routes; here they meet, in dependency order.
  const audit = createAudit({ db });
  const { repository: auditLog } = audit;
  const mail = createMail({ db, mailer, config });
  const users = createUsers({ db, audit: auditLog, mailQueue: mail.queue, config });
  const auth = createAuth({ db, users: users.repository, audit: auditLog, csrf, config });
  const organisations = createOrganisations({ db, audit: auditLog });
  const sites = createSites({ db, audit: auditLog });
  const siteAccess = { db, sites: sites.service, audit: auditLog };
  const hydrozones = createHydrozones(siteAccess);
  const weather = createWeather({ ...siteAccess, config });
  const rates = createRates(siteAccess);
  const budgets = createBudgets({
    db,
    sites: sites.service,
    hydrozones: hydrozones.service,
    weatherStations: weather.stations,
    dailyWeather: weather.daily,
    rates: rates.service,
    organisationSettings: organisations.settings,
  });
  const alerts = createAlerts({ ...siteAccess, config, mailQueue: mail.queue });
  const useDeps = { db, budgetCache: budgets.cache, rates: rates.service, alerts: alerts.service };
  const readings = createReadings({ ...useDeps, sites: sites.service });
  const portfolio = createPortfolio({ ...useDeps, dailyUse: readings.dailyUse });
  const monthClose = createMonthClose({
    ...siteAccess,
    config,
    readings: readings.service,
    alerts: alerts.service,
    organisationSettings: organisations.settings,
  });
  const meters = createMeters(siteAccess);
  const uploads = createUploads({
    ...siteAccess,
    config,
    meters: meters.service,
    organisations: organisations.settings,
    dailyWeather: weather.daily,
    dailyUse: readings.dailyUse,
  });
  const apiKeys = createApiKeys({ ...siteAccess, auth: auth.service });
  const savings = createSavings({
    ...siteAccess,
    weatherStations: weather.stations,
    dailyWeather: weather.daily,
    dailyUse: readings.dailyUse,
    rates: rates.service,
    organisationSettings: organisations.settings,
  });
  const reports = createReports({
    ...siteAccess,
    sitesRepository: sites.repository,
    budgets: budgets.service,
    dailyUse: readings.dailyUse,
    mailQueue: mail.queue,
    alerts: alerts.service,
    publicUrl: config.http.publicUrl,
  });
  const wateringRules = createWateringRules({ ...siteAccess, alerts: alerts.service });
  const watch = createWatch({
    ...siteAccess,
    wateringRules: wateringRules.service,
    config,
    budgets: budgets.service,
    rates: rates.service,
    alerts,
    dailyWeather: weather.daily,
  });
  // Field work: irrigation audits (photos in the upload store), what-if plans, achieved ETAF.
  const etaf = createEtaf({ db, sites: sites.service, budgetCache: budgets.cache, audit: auditLog });
  const fieldAudits = createFieldAudits({
    ...siteAccess,
    hydrozones: hydrozones.service,
    budgets: budgets.service,
    store: new LocalFileStore(config.uploads.dir),
  });
  const planner = createPlanner({
    ...siteAccess,
    hydrozones: hydrozones.service,
    budgets: budgets.service,
    rates: rates.service,
    etaf: etaf.service,
    savings: savings.projects,
  });
  const session = createSessionMiddleware(config, pool);

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
  api.use(createHealth({ watch: databaseWatch, version: VERSION }).router);
  api.use(databaseGate(databaseWatch));
  api.use(session.middleware);
  api.use(auth.passport.session());
  // An API key is checked before CSRF: only a request a valid key authenticated skips the CSRF check (and a key
  // reaches the machine routes only, never the auth routes).
  api.use(apiKeys.authenticate);
  api.use(csrf.protect, csrf.toAppError);
  api.use(auth.router);
  api.use(requireSignedIn);
  for (const component of [
    sites,
    hydrozones,
    weather,
    rates,
    budgets,
    readings,
    portfolio,
    organisations,
    users,
    audit,
    savings,
    reports,
    etaf,
    wateringRules,
    fieldAudits,
    planner,
    monthClose,
    meters,
    uploads,
    apiKeys,
    alerts,
    watch,
    createOutbox({ config }),
  ])
    api.use(component.router);
  api.use(notFoundHandler);
  app.use('/api', api);

  serveWebApp(app, config);
  app.use(errorHandler);

  return {
    app,
    mailQueue: mail.queue,
    watch,
    async close() {
      // A background watch run (started from the API) finishes before the pool closes under it.
      await watch.service.idle();
      auth.close();
      await databaseWatch.stop();
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
