import { Foundation1796163915429 } from './migrations/1796163915429-foundation';
import { Budgets1796170000000 } from './migrations/1796170000000-budgets';
import { Ingest1796180000000 } from './migrations/1796180000000-ingest';
import { MailAndJobs1796190000000 } from './migrations/1796190000000-mail-and-jobs';
import { DailyUse1796200000000 } from './migrations/1796200000000-daily-use';

/** Every migration, in order (explicit imports, so bundled builds need no file globbing). Add new ones at the end. */
export const MIGRATIONS: Function[] = [Foundation1796163915429, Budgets1796170000000, Ingest1796180000000, MailAndJobs1796190000000, DailyUse1796200000000];
