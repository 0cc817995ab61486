import type { DataSource } from 'typeorm';
import type { WatchRunDto, WatchRunNote } from '@shared/watch/watch-dto';
import { watchSite } from '@shared/watch/site-watch';
import type { Finding } from '@shared/watch/finding';
import type { JobLease } from '../../../jobs/job-lease';
import { logger } from '../../../platform/logger';
import type { AlertsRepository } from '../../alerts/data/alerts-repository';
import type { AlertRepairsRepository, Verdict } from '../../alerts/data/alert-repairs-repository';
import type { RepairNotifier } from '../../alerts/domain/repair-notifier';
import { verifyRepair } from '@shared/watch/repair-check';
import type { SiteWatchInput } from '@shared/watch/watch-inputs';
import type { AlertNotifier } from '../../alerts/domain/alert-notifier';
import type { SiteSettingsRow, SiteStateRow, WatchDataRepository, WatchSiteRow } from '../data/watch-data-repository';
import type { RunCounts, WatchRunsRepository } from '../data/watch-runs-repository';
import { replayNight } from './replay-night';
import { planSiteCheck } from './site-check-plan';
import type { SiteWatchInputLoader } from './site-watch-input';
import type { StationHealth } from './station-health';

export interface WatchRunRequest {
  trigger: 'scheduled' | 'manual' | 'recheck';
  /** Limit the run to one organisation's own sites (an administrator's "run now"); null checks every site. */
  organisationId: number | null;
  requestedBy: number | null;
  /** Limit the run to these sites (of the organisation). */
  siteIds?: number[];
  /** A re-check looks at [from, to) again whatever was checked before. */
  fromUtc?: Date;
  /** "Now" for the run (default: the clock). */
  toUtc?: Date;
}

export interface WatchDeps {
  db: DataSource;
  data: WatchDataRepository;
  inputs: SiteWatchInputLoader;
  alerts: AlertsRepository;
  /** Fixed alerts whose repair the data is still to confirm, and the verdicts. */
  repairs: AlertRepairsRepository;
  repairNotifier: RepairNotifier;
  runs: WatchRunsRepository;
  notifier: AlertNotifier;
  stations: StationHealth;
  lease: JobLease;
  /** Local hour after which a site's scheduled night check is due. */
  localHour: number;
}

const LEASE_MS = 10 * 60_000;
/** Sites read and checked at once; more buys little on a 2-core machine with the database on it. */
const CONCURRENCY = 4;
/** The run page's progress is written at most this often. */
const PROGRESS_MS = 1_000;

interface RunState {
  runId: number;
  request: WatchRunRequest;
  asOf: Date;
  counts: RunCounts;
  errors: WatchRunNote[];
  warnings: WatchRunNote[];
  toMail: { alertId: number; reopened: boolean }[];
  /** Fixed alerts the data did not confirm: their resolvers get a note. */
  notConfirmed: { alertId: number; at: number }[];
  checked: WatchSiteRow[];
}

interface VerdictOn {
  alertId: number;
  verdict: Verdict;
}

type SiteFindings = Finding[] & { night: string | null; verdicts: VerdictOn[] };

interface SiteContext {
  states: Map<number, SiteStateRow>;
  settings: Map<number, SiteSettingsRow>;
  latest: Map<number, Date>;
}

/**
 * The nightly watch: picks the sites with something new to look at, runs every detector over each one with the
 * look-back they need, files the findings as alerts (idempotently) and mails people about what is new. One
 * bad site is recorded and skipped; one instance at a time runs it, whatever the number of app instances. A run
 * started from the API goes on in the background; its row shows the progress.
 */
export class WatchService {
  private readonly inFlight = new Set<Promise<unknown>>();

  constructor(private readonly deps: WatchDeps) {}

  /** Waits for the run and returns it; null when another instance (or request) is running the watch right now. */
  async run(request: WatchRunRequest): Promise<WatchRunDto | null> {
    const started = await this.start(request);
    return started ? started.done : null;
  }

  /** Starts a run in the background: its id at once, the finished run later; null when the watch is busy. */
  async start(request: WatchRunRequest): Promise<{ runId: number; done: Promise<WatchRunDto> } | null> {
    const asOf = request.toUtc ?? new Date();
    // The run's row is written once the lease is ours; the work waits for its id.
    let settle!: { resolve: (id: number) => void; reject: (e: unknown) => void };
    const runIdReady = new Promise<number>((resolve, reject) => (settle = { resolve, reject }));
    const started = await this.deps.lease.startExclusive(LEASE_MS, async () =>
      this.runLocked(await runIdReady, request, asOf),
    );
    if (!started) return null;
    this.inFlight.add(started.done);
    void started.done.catch(() => undefined).finally(() => this.inFlight.delete(started.done));
    try {
      const runId = await this.deps.runs.start(request, asOf);
      settle.resolve(runId);
      return { runId, done: started.done };
    } catch (err) {
      settle.reject(err);
      throw err;
    }
  }

  /** Resolves when no run started here is still going (tests and shutdown wait for it). */
  async idle(): Promise<void> {
    while (this.inFlight.size > 0) await Promise.allSettled([...this.inFlight]);
  }

  private async runLocked(runId: number, request: WatchRunRequest, asOf: Date): Promise<WatchRunDto> {
    const run: RunState = {
      runId,
      request,
      asOf,
      counts: emptyCounts(),
      errors: [],
      warnings: [],
      toMail: [],
      notConfirmed: [],
      checked: [],
    };
    try {
      await this.checkSites(run);
      await this.checkStations(run);
      await this.mail(run);
      await this.deps.runs.finish(runId, 'done', run.counts, { errors: run.errors, warnings: run.warnings });
    } catch (err) {
      logger.error('watch run failed', { error: (err as Error).message });
      const failure = { siteId: 0, siteName: '(run)', message: (err as Error).message.slice(0, 500) };
      await this.deps.runs.finish(runId, 'failed', run.counts, {
        errors: [...run.errors, failure],
        warnings: run.warnings,
      });
    }
    return (await this.deps.runs.get(runId))!;
  }

  private async checkSites(run: RunState): Promise<void> {
    const { data } = this.deps;
    const all = await data.sites(run.request.organisationId);
    const chosen = run.request.siteIds ? new Set(run.request.siteIds) : null;
    const sites = chosen ? all.filter((s) => chosen.has(s.siteId)) : all;
    const ids = sites.map((s) => s.siteId);
    const [states, settings, latest] = await Promise.all([
      data.statesOf(ids),
      data.settingsOf(ids),
      data.latestDataOf(ids),
    ]);
    const ctx: SiteContext = { states, settings, latest };
    await this.deps.runs.progress(run.runId, sites.length, 0);
    // Reading and detecting overlap across a few sites (database waits against CPU); filing goes one site at a
    // time, so two sites' alert inserts never contend for the same index gaps.
    let filing: Promise<void> = Promise.resolve();
    let done = 0;
    let lastProgress = Date.now();
    const queue = [...sites];
    const worker = async () => {
      for (let site = queue.shift(); site; site = queue.shift()) {
        const current = site;
        const findings = await this.checkSite(run, current, ctx);
        if (findings) {
          const file = filing.then(async () => {
            await this.file(run, findings, current.timeZone);
            await this.recordVerdicts(run, findings.verdicts);
          });
          filing = file.catch(() => undefined);
          await this.guard(run, current, async () => {
            await file;
            if (run.request.trigger !== 'recheck')
              await data.saveState(current.siteId, ctx.latest.get(current.siteId) ?? null, run.asOf, findings.night);
            run.counts.sitesChecked++;
            run.checked.push(current);
          });
        }
        done++;
        if (Date.now() - lastProgress >= PROGRESS_MS) {
          lastProgress = Date.now();
          await this.deps.runs.progress(run.runId, sites.length, done);
        }
      }
    };
    await Promise.all(Array.from({ length: CONCURRENCY }, worker));
    run.errors.sort((a, b) => a.siteId - b.siteId);
    run.warnings.sort((a, b) => a.siteId - b.siteId);
  }

  /** One site's findings (with the night to remember), or null when it is skipped or fails (recorded). */
  private async checkSite(run: RunState, site: WatchSiteRow, ctx: SiteContext): Promise<SiteFindings | null> {
    let result: SiteFindings | null = null;
    await this.guard(run, site, async () => {
      const siteSettings = ctx.settings.get(site.siteId);
      const plan = planSiteCheck({
        trigger: run.request.trigger,
        rangeFrom: run.request.fromUtc,
        timeZone: site.timeZone,
        state: ctx.states.get(site.siteId),
        latest: ctx.latest.get(site.siteId) ?? null,
        asOf: run.asOf,
        localHour: this.deps.localHour,
        overrides: siteSettings?.thresholds,
      });
      if (!plan) {
        run.counts.sitesSkipped++;
        return;
      }
      const loaded = await this.deps.inputs.load(site, siteSettings, plan.fromUtc, run.asOf);
      for (const w of loaded.warnings)
        run.warnings.push({ siteId: site.siteId, siteName: site.name, message: w.message, setupOnly: w.setupOnly });
      const findings = watchSite(loaded.input);
      run.counts.findings += findings.length;
      const verdicts = await this.repairVerdicts(site.siteId, loaded.input);
      result = Object.assign(findings, { night: plan.night, verdicts });
    });
    return result;
  }

  /** The data's verdict on each repair of the site still being checked (none while nights are still to come). */
  private async repairVerdicts(siteId: number, input: SiteWatchInput): Promise<VerdictOn[]> {
    const awaiting = await this.deps.repairs.awaitingVerification(siteId);
    return awaiting.flatMap((r) => {
      const verdict = verifyRepair(
        {
          kind: r.kind,
          subKind: r.subKind,
          zoneId: r.zoneId === null ? null : String(r.zoneId),
          repairedAtUtc: r.repairedAt.getTime(),
          evidence: r.evidence,
        },
        input,
      );
      return verdict && verdict.status !== 'pending' ? [{ alertId: r.id, verdict }] : [];
    });
  }

  /** Verified repairs are marked with their evidence; the others reopen, and whoever resolved them is told. */
  private async recordVerdicts(run: RunState, verdicts: readonly VerdictOn[]): Promise<void> {
    if (verdicts.length === 0) return;
    await this.deps.db.transaction(async (em) => {
      for (const { alertId, verdict } of verdicts) {
        const recorded = await this.deps.repairs.recordVerdict(em, alertId, verdict);
        if (recorded && verdict.status === 'not-verified') {
          run.counts.alertsReopened++;
          run.notConfirmed.push({ alertId, at: verdict.decidedAtUtc });
        }
      }
    });
  }

  /** Runs one site's step; a failure (corrupt settings, odd data) is recorded and the others go on. */
  private async guard(run: RunState, site: WatchSiteRow, step: () => Promise<void>): Promise<void> {
    try {
      await step();
    } catch (err) {
      run.errors.push({ siteId: site.siteId, siteName: site.name, message: (err as Error).message.slice(0, 500) });
    }
  }

  /** Weather stations of the checked sites with missing or late days: one alert per gap. */
  private async checkStations(run: RunState): Promise<void> {
    if (run.checked.length === 0) return;
    const findings = await this.deps.stations.findings(run.checked, run.asOf);
    run.counts.findings += findings.length;
    await this.file(run, findings, null);
  }

  private async mail(run: RunState): Promise<void> {
    try {
      run.counts.mailsQueued = await this.deps.notifier.notify({
        alerts: run.toMail,
        night: run.asOf.toISOString().slice(0, 10),
        warnings: run.warnings,
      });
      run.counts.mailsQueued += await this.deps.repairNotifier.notConfirmed(run.notConfirmed);
    } catch (err) {
      run.errors.push({ siteId: 0, siteName: '(e-mail)', message: (err as Error).message.slice(0, 500) });
    }
  }

  /**
   * Files findings in the order they were first detectable. A re-check replays the nights: each finding is filed as
   * the nightly job would have first seen it, so "first detected" dates are those nights, not today.
   */
  private async file(run: RunState, findings: readonly Finding[], timeZone: string | null): Promise<void> {
    if (findings.length === 0) return;
    const wall = new Date();
    const replay = run.request.trigger === 'recheck';
    const ordered = [...findings].sort((a, b) => a.detectedAtUtc - b.detectedAtUtc || a.key.localeCompare(b.key));
    await this.deps.db.transaction(async (em) => {
      for (const f of ordered) {
        const now = replay ? replayNight(f.detectedAtUtc, timeZone ?? 'UTC', this.deps.localHour, run.asOf) : wall;
        const { outcome, alertId } = await this.deps.alerts.fileFinding(em, f, now);
        if (outcome === 'raised') run.counts.alertsRaised++;
        if (outcome === 'updated') run.counts.alertsUpdated++;
        if (outcome === 'reopened') run.counts.alertsReopened++;
        if (
          outcome === 'reopened' &&
          alertId &&
          (await this.deps.repairs.markNotConfirmed(em, alertId, f.periodEndUtc))
        )
          run.notConfirmed.push({ alertId, at: f.periodEndUtc });
        if ((outcome === 'raised' || outcome === 'reopened') && alertId)
          run.toMail.push({ alertId, reopened: outcome === 'reopened' });
      }
    });
  }
}

function emptyCounts(): RunCounts {
  return {
    sitesChecked: 0,
    sitesSkipped: 0,
    findings: 0,
    alertsRaised: 0,
    alertsUpdated: 0,
    alertsReopened: 0,
    mailsQueued: 0,
  };
}
