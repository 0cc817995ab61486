import { loadConfig } from '../../backend/src/config';
import { connectWithRetry } from '../../backend/src/db/connect';
import { createDataSource } from '../../backend/src/db/data-source';
import { logger } from '../../backend/src/platform/logger';
import { seedBudgets } from './seed-budgets';
import { seedDemo } from './seed-demo';
import { seedMeters } from './seed-meters';
import { seedSavings } from './seed-savings';
import { seedAlerts } from './seed-alerts';
import { seedFieldWork } from './seed-field-work';
import { seedVerifiedRepair, seedWateringRules } from './seed-field-tools';

/** `npm run seed`: writes the demo scenario into the configured database (idempotent). */
const db = createDataSource(loadConfig().db);
await connectWithRetry(db, { attempts: 10 });
const counts = await seedDemo(db);
logger.info(
  `demo scenario seeded: ${counts.organisations} organisations, ${counts.users} users, ${counts.sites} sites`,
);
const budgets = await seedBudgets(db);
logger.info(
  `demo budgets seeded: ${budgets.stations} weather stations, ${budgets.days} ` +
    `days of weather, ${budgets.hydrozones} hydrozones`,
);
const water = await seedMeters(db, loadConfig());
logger.info(
  `demo meters seeded: ${water.meters} meters; ${water.uploads} new uploads with ${water.readings} readings and runs`,
);
const savings = await seedSavings(db);
logger.info(`demo savings seeded: ${savings.readings} daily readings, ${savings.projects} new savings projects`);
const fieldWork = await seedFieldWork(db, loadConfig());
logger.info(`demo field work seeded: ${fieldWork.audits} new audits, ${fieldWork.plans} new what-if plans`);
const rules = await seedWateringRules(db);
logger.info(`demo watering rules seeded: ${rules} new agency rule(s)`);
// Last: the watch reads everything seeded above.
const watched = await seedAlerts(db, loadConfig());
logger.info(
  `demo watch run: ${watched.alerts} alerts (${Object.entries(watched.byKind)
    .map(([k, n]) => `${k} ${n}`)
    .join(', ')}); ${watched.mails} e-mails queued`,
);
const repaired = await seedVerifiedRepair(db, loadConfig());
logger.info(`demo repair: ${repaired} leak resolved as fixed and re-checked against the meter`);
await db.destroy();
