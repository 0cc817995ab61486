/**
 * Measured detection quality: every detector over every synthetic scenario, scored against the injected events.
 * Prints the table and writes it to test-artifacts/detection-quality.md for the README.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { estimateControllerShiftMinutes } from '../../shared/watch/controller-clock-skew';
import type { Finding } from '../../shared/watch/finding';
import { watchSite } from '../../shared/watch/site-watch';
import type { SiteWatchInput } from '../../shared/watch/watch-inputs';
import {
  formatQualityMarkdown,
  SCORED_KINDS,
  scoreOutcomes,
  type QualityReport,
  type ScenarioOutcome,
} from './detection-scoring';
import { buildScenarios } from './scenario-catalogue';
import { seedFrom } from './seeded-random';
import { SITE_PROFILES } from './synthetic-site-profiles';
import { generateSite, type SyntheticSite } from './synthetic-sites';

const ARTIFACT = resolve(import.meta.dirname, '../../test-artifacts/detection-quality.md');

const scenarios = buildScenarios();
let sites: Array<{ id: string; site: SyntheticSite }>;
let outcomes: ScenarioOutcome[];
let report: QualityReport;

function runAll(adjust: (input: SiteWatchInput) => SiteWatchInput = (i) => i): ScenarioOutcome[] {
  return sites.map(({ id, site }) => ({
    scenarioId: id,
    truth: site.truth,
    findings: watchSite(adjust(site.input)),
    dayBoundsUtc: site.dayBoundsUtc,
  }));
}

beforeAll(() => {
  sites = scenarios.map((s) => ({ id: s.id, site: generateSite(s) }));
  outcomes = runAll();
  report = scoreOutcomes(outcomes);
  const markdown = formatQualityMarkdown(report, scenarios.length);
  console.log('Per event:');
  console.table(report.scores.map((s) => ({ ...s, precision: s.precision.toFixed(3), recall: s.recall.toFixed(3) })));
  console.log('Per site-day:');
  console.table(
    report.dayScores.map((s) => ({ ...s, precision: s.precision.toFixed(3), recall: s.recall.toFixed(3) })),
  );
  if (report.misses.length > 0) console.log(`Missed:\n${report.misses.join('\n')}`);
  if (report.falseAlarms.length > 0) console.log(`False alarms:\n${report.falseAlarms.join('\n')}`);
  mkdirSync(resolve(ARTIFACT, '..'), { recursive: true });
  writeFileSync(ARTIFACT, markdown);
}, 120_000);

describe('detection quality on synthetic sites', () => {
  it('has enough true events per detector for 0.9 to mean something', () => {
    for (const s of report.scores) expect(s.events, s.kind).toBeGreaterThanOrEqual(10);
  });

  it.each(SCORED_KINDS)('%s: precision and recall are both at least 0.9 per event', (kind) => {
    const s = report.scores.find((x) => x.kind === kind)!;
    expect(s.precision, `${kind} precision`).toBeGreaterThanOrEqual(0.9);
    expect(s.recall, `${kind} recall`).toBeGreaterThanOrEqual(0.9);
  });

  it.each(SCORED_KINDS)('%s: precision and recall are both at least 0.9 per site-day', (kind) => {
    const s = report.dayScores.find((x) => x.kind === kind)!;
    expect(s.precision, `${kind} precision per day`).toBeGreaterThanOrEqual(0.9);
    expect(s.recall, `${kind} recall per day`).toBeGreaterThanOrEqual(0.9);
  });

  it('flags every over month when a weather day at its end is missing and there are no normals', () => {
    const family = outcomes.filter((o) => o.scenarioId.startsWith('overspend-missing-weather'));
    const missed = family.filter((o) => !o.findings.some((f) => f.kind === 'overspend' && f.scope !== undefined));
    expect(missed.map((o) => o.scenarioId)).toEqual([]);
    const texts = family.flatMap((o) => o.findings.filter((f) => f.kind === 'overspend').map((f) => f.explanation));
    expect(texts.some((t) => /covers \d+ of \d+ days/.test(t))).toBe(true);
  });

  it('keeps months back to back as one alert each: no overspend finding runs past its calendar month', () => {
    const spill = outcomes.flatMap((o) =>
      o.findings
        .filter((f) => f.kind === 'overspend')
        .filter((f) => f.periodEndUtc - f.periodStartUtc > 31 * 86_400_000 || !f.scope)
        .map((f) => `${o.scenarioId} ${f.key}`),
    );
    expect(spill).toEqual([]);
    const twoMonths = outcomes.filter((o) => o.scenarioId.startsWith('overspend-back-to-back'));
    const counts = twoMonths.map(
      (o) => new Set(o.findings.filter((f) => f.kind === 'overspend').map((f) => f.scope)).size,
    );
    expect(counts.filter((n) => n < 2)).toEqual([]);
  });

  it('raises one leak alert and no valve alert for a leak that starts inside the watering window', () => {
    const family = outcomes.filter((o) => o.scenarioId.startsWith('leak-across-window'));
    const valves = family.flatMap((o) => o.findings.filter((f) => f.subKind === 'open-valve').map(() => o.scenarioId));
    expect(valves).toEqual([]);
    const leakAlerts = family.map((o) => {
      const leak = o.truth.find((t) => t.kind === 'leak')!;
      return o.findings.filter(
        (f) => f.kind === 'leak' && f.periodStartUtc < leak.endUtc && leak.startUtc < f.periodEndUtc,
      ).length;
    });
    expect(leakAlerts.filter((n) => n !== 1)).toEqual([]);
  });

  it('reports the water lost by a valve stuck open at its design flow within 5 % of the true excess', () => {
    const rows = outcomes
      .filter((o) => o.scenarioId.startsWith('valve-over-a-day'))
      .map((o) => {
        const truth = o.truth.find((t) => t.excessGal !== undefined)!;
        const lost = o.findings
          .filter(
            (f) => f.subKind === 'open-valve' && f.periodStartUtc < truth.endUtc && truth.startUtc < f.periodEndUtc,
          )
          .reduce((s, f) => s + (f.waterLostGal ?? 0), 0);
        return { id: o.scenarioId, error: lost / truth.excessGal! - 1 };
      });
    console.log(`Valve water lost vs true excess: ${rows.map((r) => `${(r.error * 100).toFixed(1)} %`).join(', ')}`);
    expect(rows.filter((r) => Math.abs(r.error) > 0.05)).toEqual([]);
  });

  it('names zones by their labels, never by a bare id, in every explanation', () => {
    const texts = outcomes.flatMap((o) => o.findings.map((f) => f.explanation));
    expect(texts.filter((t) => /zones? \d/.test(t))).toEqual([]);
  });

  it('names the zone at fault, alone when the data can tell, among the suspects when zones share meter hours', () => {
    const rows = outcomes.flatMap((o) =>
      o.truth
        .filter((t) => t.zoneId)
        .flatMap((t) =>
          o.findings
            .filter((f) => f.kind === 'runaway-zone' && f.periodStartUtc < t.endUtc && t.startUtc < f.periodEndUtc)
            .map((f) => ({
              id: o.scenarioId,
              exact: f.zoneId === t.zoneId,
              among: f.suspectZoneIds?.includes(t.zoneId!) ?? false,
            })),
        ),
    );
    const exact = rows.filter((r) => r.exact).length;
    console.log(
      `Zone named alone: ${exact} of ${rows.length} findings; among suspects: ${rows.filter((r) => r.among).length}`,
    );
    expect(rows.length).toBeGreaterThanOrEqual(20);
    expect(rows.filter((r) => !r.exact && !r.among).map((r) => r.id)).toEqual([]);
    // Long runs come from the controller log, so they always name one zone.
    expect(rows.filter((r) => r.id.startsWith('long-run') && !r.exact)).toEqual([]);
  });

  it(
    'recovers the controller clock offset the generator put in to ' + 'within two minutes, on sites with hourly data',
    () => {
      const hourly = sites.filter(({ site }) => site.input.meterHours);
      const errors = hourly.map(
        ({ site }) =>
          estimateControllerShiftMinutes(site.input.meterHours!, site.input.runs, site.input.zones, 15) +
          site.controllerClockAheadMinutes,
      );
      console.log(
        `Controller clock shift error, minutes: ${[...new Set(errors)]
          .sort((a, b) => a - b)
          .map((e) => `${e}: ${errors.filter((x) => x === e).length}`)
          .join(', ')}`,
      );
      expect(errors.filter((e) => Math.abs(e) <= 2).length / errors.length).toBeGreaterThanOrEqual(0.9);
    },
  );

  it('raises nothing over a whole clean year on any site, through every season and both DST changes', () => {
    const findings = SITE_PROFILES.flatMap((profile) =>
      watchSite(
        generateSite({
          id: `clean-year-${profile.name}`,
          profile,
          seed: seedFrom(`clean-year/${profile.name}`),
          startDate: '2026-01-01',
          days: 365,
          event: null,
        }).input,
      ).map((f) => `${profile.name}: ${f.kind}/${f.subKind} ${new Date(f.periodStartUtc).toISOString()}`),
    );
    expect(findings).toEqual([]);
  }, 60_000);

  it('raises nothing at all during the rainy weeks, whose runs were skipped', () => {
    const rainy = outcomes.filter((o) => o.truth.some((t) => t.kind === 'none'));
    expect(rainy.length).toBeGreaterThanOrEqual(10);
    const during = rainy.flatMap((o) => {
      const quiet = o.truth.find((t) => t.kind === 'none')!;
      return o.findings
        .filter((f) => f.periodStartUtc < quiet.endUtc && quiet.startUtc < f.periodEndUtc)
        .map((f) => `${o.scenarioId} ${f.key}`);
    });
    expect(during).toEqual([]);
  });

  it('would flag the rainy weeks if skipped runs were read as watering (the trap is real)', () => {
    const naive = runAll((input) => ({
      ...input,
      runs: input.runs.map((r) => (r.cause === 'skipped-rain' ? { ...r, cause: 'scheduled' as const } : r)),
    }));
    const rainyIds = new Set(sites.filter(({ site }) => site.truth.some((t) => t.kind === 'none')).map(({ id }) => id));
    const flagged = naive.filter(
      (o) => rainyIds.has(o.scenarioId) && o.findings.some((f: Finding) => f.subKind === 'zero-while-running'),
    );
    expect(flagged.length).toBeGreaterThanOrEqual(rainyIds.size - 1);
  }, 60_000);

  it('loses precision when thresholds are loosened, so the measure can fail', () => {
    const loose = scoreOutcomes(
      runAll((input) => ({
        ...input,
        site: {
          ...input.site,
          thresholds: {
            continuousFlowHours: 6,
            nightFlowMadK: 0,
            nightFlowMinExcessGph: 0,
            longRunMinRatio: 1.05,
            longRunMadK: 1,
            monthToDateRatio: 0.9,
            projectedRatio: 0.9,
            zeroFlowMaxShare: 1,
            zeroFlowMinDays: 1,
          },
        },
      })),
    );
    for (const kind of SCORED_KINDS) {
      expect(loose.scores.find((s) => s.kind === kind)!.precision, kind).toBeLessThan(0.9);
    }
  }, 60_000);

  it('is deterministic: the same scenarios give the same finding keys', () => {
    const again = runAll();
    expect(again.map((o) => o.findings.map((f) => f.key))).toEqual(outcomes.map((o) => o.findings.map((f) => f.key)));
  }, 60_000);
});
