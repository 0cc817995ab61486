import { Foundation1796163915429 } from './migrations/1796163915429-foundation';
import { Budgets1796170000000 } from './migrations/1796170000000-budgets';
import { MailAndJobs1796190000000 } from './migrations/1796190000000-mail-and-jobs';

/** Every migration, in order (explicit imports, so bundled builds need no file globbing). Add new ones at the end. */
export const MIGRATIONS: Function[] = [Foundation1796163915429, Budgets1796170000000, MailAndJobs1796190000000];
