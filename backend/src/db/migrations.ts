import type { MigrationInterface } from 'typeorm';
import { Foundation1796163915429 } from './migrations/1796163915429-foundation';
import { Budgets1796170000000 } from './migrations/1796170000000-budgets';
import { Ingest1796180000000 } from './migrations/1796180000000-ingest';
import { MailAndJobs1796190000000 } from './migrations/1796190000000-mail-and-jobs';
import { DailyUse1796200000000 } from './migrations/1796200000000-daily-use';
import { SiteMonthlyBudget1796210000000 } from './migrations/1796210000000-site-monthly-budget';
import { DashboardIndexes1796230000000 } from './migrations/1796230000000-dashboard-indexes';
import { Watch1796215000000 } from './migrations/1796215000000-watch';
import { Reports1796220000000 } from './migrations/1796220000000-reports';
import { MonthlyUse1796240000000 } from './migrations/1796240000000-monthly-use';
import { WatchImperfectData1796250000000 } from './migrations/1796250000000-watch-imperfect-data';
import { FieldAudits1796300000000 } from './migrations/1796300000000-field-audits';
import { WhatIfPlans1796300001000 } from './migrations/1796300001000-what-if-plans';
import { SiteEtafSettings1796300002000 } from './migrations/1796300002000-site-etaf-settings';
import { Hardening1796320000000 } from './migrations/1796320000000-hardening';
import { RoleMonths1796330000000 } from './migrations/1796330000000-role-months';
import { WateringRulesAndRepairs1796340000000 } from './migrations/1796340000000-watering-rules-and-repairs';
import { IngestDecisions1796350000000 } from './migrations/1796350000000-ingest-decisions';
import { BudgetCacheReasons1796360000000 } from './migrations/1796360000000-budget-cache-reasons';

/** Every migration, in order (explicit imports, so bundled builds need no file globbing). Add new ones at the end. */
export const MIGRATIONS: (new () => MigrationInterface)[] = [
  Foundation1796163915429,
  Budgets1796170000000,
  Ingest1796180000000,
  MailAndJobs1796190000000,
  DailyUse1796200000000,
  SiteMonthlyBudget1796210000000,
  Reports1796220000000,
  Watch1796215000000,
  DashboardIndexes1796230000000,
  MonthlyUse1796240000000,
  WatchImperfectData1796250000000,
  FieldAudits1796300000000,
  WhatIfPlans1796300001000,
  SiteEtafSettings1796300002000,
  Hardening1796320000000,
  RoleMonths1796330000000,
  WateringRulesAndRepairs1796340000000,
  IngestDecisions1796350000000,
  BudgetCacheReasons1796360000000,
];
