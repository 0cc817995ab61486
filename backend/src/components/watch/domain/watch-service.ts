import type { DataSource } from 'typeorm';
import type { WatchRunDto } from '@shared/watch/watch-dto';
import { watchSite } from '@shared/watch/site-watch';
import type { Finding } from '@shared/watch/finding';
import type { JobLease } from '../../../jobs/job-lease';
import { logger } from '../../../platform/logger';
import type { AlertsRepository } from '../../alerts/data/alerts-repository';
import type { AlertNotifier } from '../../alerts/domain/alert-notifier';
import type { WatchDataRepository } from '../data/watch-data-repository';
import type { WatchRunsRepository } from '../data/watch-runs-repository';
import { planSiteCheck } from './site-check-plan';
import type { SiteWatchInputLoader } from './site-watch-input';

export interface WatchRunRequest {
  trigger: 'scheduled' | 'manual' | 'recheck';
  /** Limit the run to one organisation's own sites (an administrator's "run now"); null checks every site. */
  organisationId: number | null;
  requestedBy: number | null;
  /** A re-check looks at [from, to) again whatever was checked before. */
  fromUtc?: Date;
  /** "Now" for the run (default: the clock). */
  toUtc?: Date;
}

const LEASE_MS = 10 * 60_000;
/** Sites read and checked at once; more buys little on a 2-core machine with the database on it. */
const CONCURRENCY = 4;

/**
 * The nightly watch: picks the sites with something new to look at, runs every detector over each one with the
 * look-back they need, files the findings as alerts (idempotently) and mails people about what is new. One
 * bad site is recorded and skipped; one instance at a time runs it, whatever the number of app instances.
 */
export class WatchService {
  constructor(
    private readonly db: DataSource,
    private readonly data: WatchDataRepository,
    private readonly inputs: SiteWatchInputLoader,
    private readonly alerts: AlertsRepository,
    private readonly runs: WatchRunsRepository,
    private readonly notifier: AlertNotifier,
    private readonly lease: JobLease,
    /** Local hour after which a site's scheduled night check is due. */
    private readonly localHour: number,
  ) {}

  /** Null when another instance (or another request) is running the watch right now. */
  run(request: WatchRunRequest): Promise<WatchRunDto | null> {
    return this.lease.runExclusive(LEASE_MS, () => this.runLocked(request));
  }

  private async runLocked(request: WatchRunRequest): Promise<WatchRunDto> {
    const asOf = request.toUtc ?? new Date();
    const runId = await this.runs.start(request, asOf);
    const counts = {
      sitesChecked: 0,
      sitesSkipped: 0,
      findings: 0,
      alertsRaised: 0,
      alertsUpdated: 0,
      alertsReopened: 0,
      mailsQueued: 0,
    };
    const errors: { siteId: number; siteName: string; message: string }[] = [];
    const toMail: { alertId: number; reopened: boolean }[] = [];
    try {
      const sites = await this.data.sites(request.organisationId);
      const ids = sites.map((s) => s.siteId);
      const [states, settings, latest] = await Promise.all([
        this.data.statesOf(ids),
        this.data.settingsOf(ids),
        this.data.latestDataOf(ids),
      ]);
      // Reading and detecting overlap across a few sites (database waits against CPU); filing goes one site at a
      // time, so two sites' alert inserts never contend for the same index gaps.
      let filing: Promise<void> = Promise.resolve();
      const queue = [...sites];
      const worker = async () => {
        for (let site = queue.shift(); site; site = queue.shift()) {
          const current = site;
          try {
            const state = states.get(current.siteId);
            const siteSettings = settings.get(current.siteId);
            const plan = planSiteCheck(
              request.trigger,
              request.fromUtc,
              current.timeZone,
              state,
              latest.get(current.siteId) ?? null,
              asOf,
              this.localHour,
              siteSettings?.thresholds,
            );
            if (!plan) {
              counts.sitesSkipped++;
              continue;
            }
            const input = await this.inputs.load(current, siteSettings, plan.fromUtc, asOf);
            const findings = watchSite(input);
            counts.findings += findings.length;
            const file = filing.then(() => this.file(findings, counts, toMail));
            filing = file.catch(() => undefined);
            await file;
            if (request.trigger !== 'recheck')
              await this.data.saveState(current.siteId, latest.get(current.siteId) ?? null, asOf, plan.night);
            counts.sitesChecked++;
          } catch (err) {
            // One bad site (corrupt settings, odd data) must not stop the others; the run records why.
            errors.push({
              siteId: current.siteId,
              siteName: current.name,
              message: (err as Error).message.slice(0, 500),
            });
          }
        }
      };
      await Promise.all(Array.from({ length: CONCURRENCY }, worker));
      errors.sort((a, b) => a.siteId - b.siteId);
      try {
        counts.mailsQueued = await this.notifier.notify(toMail, asOf.toISOString().slice(0, 10));
      } catch (err) {
        errors.push({ siteId: 0, siteName: '(e-mail)', message: (err as Error).message.slice(0, 500) });
      }
      await this.runs.finish(runId, 'done', counts, errors);
    } catch (err) {
      logger.error('watch run failed', { error: (err as Error).message });
      await this.runs.finish(runId, 'failed', counts, [
        ...errors,
        { siteId: 0, siteName: '(run)', message: (err as Error).message.slice(0, 500) },
      ]);
    }
    return (await this.runs.get(runId))!;
  }

  private async file(
    findings: Finding[],
    counts: { alertsRaised: number; alertsUpdated: number; alertsReopened: number },
    toMail: { alertId: number; reopened: boolean }[],
  ): Promise<void> {
    if (findings.length === 0) return;
    const now = new Date();
    await this.db.transaction(async (em) => {
      for (const f of findings) {
        const { outcome, alertId } = await this.alerts.fileFinding(em, f, now);
        if (outcome === 'raised') counts.alertsRaised++;
        if (outcome === 'updated') counts.alertsUpdated++;
        if (outcome === 'reopened') counts.alertsReopened++;
        if ((outcome === 'raised' || outcome === 'reopened') && alertId)
          toMail.push({ alertId, reopened: outcome === 'reopened' });
      }
    });
  }
}
