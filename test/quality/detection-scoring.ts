/**
 * Scores findings against ground truth, per detector (finding kind). A finding is a hit when it overlaps a true
 * event of its kind; "explained" when it overlaps an event that also rightly causes that kind (see
 * synthetic-sites.ts), which counts neither way; otherwise a false alarm. An event is found when at least one
 * finding of its kind overlaps it. "Explained" also needs the event to have begun before the finding was first
 * detected: an overspend flagged before a leak began is a false alarm, whatever the leak did later.
 */
import { FINDING_KINDS, type Finding, type FindingKind } from '../../shared/watch/finding';
import { median } from '../../shared/watch/robust-statistics';
import type { GroundTruthEvent } from './synthetic-sites';

/** The kinds `watchSite` finds; weather-station health is the nightly job's own check, scored in the API tests. */
export const SCORED_KINDS = FINDING_KINDS.filter((k) => k !== 'weather' && k !== 'watering-rules');

export interface ScenarioOutcome {
  scenarioId: string;
  truth: GroundTruthEvent[];
  findings: Finding[];
  /** Local midnights bounding the scenario's days (site-days for the per-day score). */
  dayBoundsUtc: number[];
}

/**
 * Per detector, counted over site-days: a day is true when an event of the kind touches it, flagged when a finding
 * does.
 */
export interface DayScore {
  kind: FindingKind;
  trueDays: number;
  flaggedDays: number;
  hitDays: number;
  /** Flagged days that only an event rightly causing this kind too explains: counted neither way. */
  explainedDays: number;
  falseDays: number;
  precision: number;
  recall: number;
}

export interface DetectorScore {
  kind: FindingKind;
  events: number;
  found: number;
  findings: number;
  hits: number;
  explained: number;
  falseAlarms: number;
  precision: number;
  recall: number;
  /** Median hours from an event's start to its first detection, over found events. */
  medianHoursToDetect: number | null;
}

export interface QualityReport {
  scores: DetectorScore[];
  dayScores: DayScore[];
  /** Findings per sub-kind and verdict, to see which check did the work. */
  bySubKind: Array<{ kind: FindingKind; subKind: string; hits: number; explained: number; falseAlarms: number }>;
  /** Per scenario family (the scenario id without its number): events found, by which checks, and false alarms. */
  byFamily: Array<{
    family: string;
    scenarios: number;
    events: number;
    found: number;
    foundBy: string[];
    falseAlarms: number;
  }>;
  misses: string[];
  falseAlarms: string[];
}

function familyTable(outcomes: readonly ScenarioOutcome[]): QualityReport['byFamily'] {
  const families = new Map<string, QualityReport['byFamily'][number] & { checks: Map<string, number> }>();
  for (const o of outcomes) {
    const family = o.scenarioId.replace(/-\d+$/, '');
    const row = families.get(family) ?? {
      family,
      scenarios: 0,
      events: 0,
      found: 0,
      foundBy: [],
      falseAlarms: 0,
      checks: new Map(),
    };
    row.scenarios += 1;
    for (const e of o.truth.filter((t) => t.kind !== 'none')) {
      row.events += 1;
      const matching = o.findings.filter((f) => f.kind === e.kind && overlaps(f, e));
      if (matching.length > 0) row.found += 1;
      for (const check of new Set(matching.map((f) => f.subKind)))
        row.checks.set(check, (row.checks.get(check) ?? 0) + 1);
    }
    row.falseAlarms += o.findings.filter((f) => verdictOf(f, o.truth) === 'false-alarm').length;
    families.set(family, row);
  }
  return [...families.values()].map(({ checks, ...row }) => ({
    ...row,
    foundBy: [...checks].map(([check, n]) => `${check} ${n}`),
  }));
}

const overlaps = (f: Finding, e: GroundTruthEvent) => f.periodStartUtc < e.endUtc && e.startUtc < f.periodEndUtc;

type Verdict = 'hit' | 'explained' | 'false-alarm';

function verdictOf(finding: Finding, truth: readonly GroundTruthEvent[]): Verdict {
  if (truth.some((e) => e.kind === finding.kind && overlaps(finding, e))) return 'hit';
  if (
    truth.some(
      (e) => e.alsoExplains.includes(finding.kind) && overlaps(finding, e) && e.startUtc < finding.detectedAtUtc,
    )
  )
    return 'explained';
  return 'false-alarm';
}

function dayScore(kind: FindingKind, outcomes: readonly ScenarioOutcome[]): DayScore {
  const counts = { trueDays: 0, flaggedDays: 0, hitDays: 0, explainedDays: 0, falseDays: 0 };
  for (const o of outcomes) {
    const findings = o.findings.filter((f) => f.kind === kind);
    for (let d = 0; d + 1 < o.dayBoundsUtc.length; d++) {
      const day = { startUtc: o.dayBoundsUtc[d]!, endUtc: o.dayBoundsUtc[d + 1]! };
      const touches = (a: { startUtc: number; endUtc: number }) => a.startUtc < day.endUtc && day.startUtc < a.endUtc;
      const isTrue = o.truth.some((e) => e.kind === kind && touches(e));
      const onDay = findings.filter((f) => touches({ startUtc: f.periodStartUtc, endUtc: f.periodEndUtc }));
      if (isTrue) counts.trueDays += 1;
      if (onDay.length === 0) continue;
      counts.flaggedDays += 1;
      if (isTrue) counts.hitDays += 1;
      else if (onDay.every((f) => verdictOf(f, o.truth) !== 'false-alarm')) counts.explainedDays += 1;
      else counts.falseDays += 1;
    }
  }
  const judged = counts.hitDays + counts.falseDays;
  return {
    kind,
    ...counts,
    precision: judged === 0 ? 0 : counts.hitDays / judged,
    recall: counts.trueDays === 0 ? 0 : counts.hitDays / counts.trueDays,
  };
}

const iso = (ms: number) => new Date(ms).toISOString().slice(0, 16);

export function scoreOutcomes(outcomes: readonly ScenarioOutcome[]): QualityReport {
  const misses: string[] = [];
  const falseAlarms: string[] = [];
  const subKinds = new Map<
    string,
    { kind: FindingKind; subKind: string; hits: number; explained: number; falseAlarms: number }
  >();
  const scores = SCORED_KINDS.map((kind): DetectorScore => {
    let events = 0;
    let found = 0;
    let findings = 0;
    let hits = 0;
    let explained = 0;
    let alarms = 0;
    const delays: number[] = [];
    for (const o of outcomes) {
      for (const e of o.truth.filter((t) => t.kind === kind)) {
        events += 1;
        const matching = o.findings.filter((f) => f.kind === kind && overlaps(f, e));
        if (matching.length > 0) {
          found += 1;
          delays.push(Math.max(0, Math.min(...matching.map((f) => f.detectedAtUtc)) - e.startUtc) / 3_600_000);
        } else misses.push(`${o.scenarioId}: missed ${e.label} (${iso(e.startUtc)} → ${iso(e.endUtc)})`);
      }
      for (const f of o.findings.filter((x) => x.kind === kind)) {
        findings += 1;
        const verdict = verdictOf(f, o.truth);
        const row = subKinds.get(`${kind}/${f.subKind}`) ?? {
          kind,
          subKind: f.subKind,
          hits: 0,
          explained: 0,
          falseAlarms: 0,
        };
        if (verdict === 'hit') {
          hits += 1;
          row.hits += 1;
        } else if (verdict === 'explained') {
          explained += 1;
          row.explained += 1;
        } else {
          alarms += 1;
          row.falseAlarms += 1;
          falseAlarms.push(
            `${o.scenarioId}: ${f.kind}/${f.subKind}${f.zoneId ? ` ${f.zoneId}` : ''} ` +
              `${iso(f.periodStartUtc)} → ${iso(f.periodEndUtc)}: ${f.explanation}`,
          );
        }
        subKinds.set(`${kind}/${f.subKind}`, row);
      }
    }
    const judged = hits + alarms;
    return {
      kind,
      events,
      found,
      findings,
      hits,
      explained,
      falseAlarms: alarms,
      // No findings at all is no evidence of precision: score it 0 so the assertion fails.
      precision: judged === 0 ? 0 : hits / judged,
      recall: events === 0 ? 0 : found / events,
      medianHoursToDetect: delays.length > 0 ? median(delays) : null,
    };
  });
  return {
    scores,
    dayScores: SCORED_KINDS.map((kind) => dayScore(kind, outcomes)),
    byFamily: familyTable(outcomes),
    bySubKind: [...subKinds.values()].sort((a, b) => `${a.kind}/${a.subKind}`.localeCompare(`${b.kind}/${b.subKind}`)),
    misses,
    falseAlarms,
  };
}

export function formatQualityMarkdown(report: QualityReport, scenarioCount: number): string {
  const pct = (v: number) => `${(v * 100).toFixed(1)} %`;
  const lines = [
    `Detection quality on ${scenarioCount} synthetic scenarios (seeded; \`test/quality/detection-quality.test.ts\`).`,
    '',
    '| Detector | True events | Found | Findings | Hits | Explained ' +
      'by another event | False alarms | Precision | Recall | Median hours to detect |',
    '|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|',
    ...report.scores.map(
      (s) =>
        `| ${s.kind} | ${s.events} | ${s.found} | ${s.findings} | ${s.hits} ` +
        `| ${s.explained} | ${s.falseAlarms} | ${pct(s.precision)} | ` +
        `${pct(s.recall)} | ${s.medianHoursToDetect === null ? '–' : s.medianHoursToDetect.toFixed(0)} |`,
    ),
    '',
    'Per site-day (a day is true when an injected event of the kind touches it, flagged when a finding does):',
    '',
    '| Detector | True days | Flagged days | Hit days | Explained days | False days | Precision | Recall |',
    '|---|---:|---:|---:|---:|---:|---:|---:|',
    ...report.dayScores.map(
      (s) =>
        `| ${s.kind} | ${s.trueDays} | ${s.flaggedDays} | ${s.hitDays} | ${s.explainedDays} | ${s.falseDays} ` +
        `| ${pct(s.precision)} | ${pct(s.recall)} |`,
    ),
    '',
    'Findings by check:',
    '',
    '| Detector | Check | Hits | Explained | False alarms |',
    '|---|---|---:|---:|---:|',
    ...report.bySubKind.map((r) => `| ${r.kind} | ${r.subKind} | ${r.hits} | ${r.explained} | ${r.falseAlarms} |`),
    '',
    'By injected event (each event counted once per check that found it):',
    '',
    '| Scenario family | Scenarios | Events | Found | Found by | False alarms |',
    '|---|---:|---:|---:|---|---:|',
    ...report.byFamily.map(
      (r) =>
        `| ${r.family} | ${r.scenarios} | ${r.events} | ${r.found} | ` +
        `${r.foundBy.join(', ') || '–'} | ${r.falseAlarms} |`,
    ),
    '',
    'Precision = hits ÷ (hits + false alarms); recall = true events ' +
      'found ÷ true events. "Explained" findings overlap an',
    'injected event that rightly causes that kind too (a stuck valve ' +
      'is also continuous flow; a large leak also overspends)',
    "and that began before the finding was first detected. Hours to detect run from the event's start to the first",
    'moment the data met the condition; the nightly job adds up to a day on top.',
  ];
  return `${lines.join('\n')}\n`;
}
