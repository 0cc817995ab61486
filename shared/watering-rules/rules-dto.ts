/** What the watering-rules API sends: the officer's worklist of rule-breaking watering per site and month. */
import type { Page } from '../api/page';
import type { AlertStatus } from '../alerts/alert-dto';
import type { Severity } from '../watch/finding';

export const RULE_SORTS = ['name', 'from'] as const;

export interface RuleWorklistRow {
  siteId: number;
  siteName: string;
  month: string;
  /** The watch's alert for the site and month, listing the runs. */
  alertId: number;
  status: AlertStatus;
  severity: Severity;
  runsOutsideRules: number;
  /** Runs the log marks as manual: shown, but apart, and never the reason for the alert. */
  manualRunsOutsideRules: number;
  minutesOutsideRules: number;
  notAWateringDay: number;
  outsideAllowedHours: number;
  overStationLimit: number;
  /** Judged from metered hours because the site sends no controller log. */
  fromMeterOnly: number;
}

export type RuleWorklistDto = Page<RuleWorklistRow> & { month: string; sitesUnderRules: number };
