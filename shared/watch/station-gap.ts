/**
 * Weather-station health: a run of days a station is missing (or a station that has gone quiet) makes every budget
 * that uses it estimated or partial. One finding per gap, filed on one site that uses the station, for the people
 * who can upload or fetch the days. Built by the nightly job (the detectors never see stations).
 */
import { findingKeyOf, conditionKeyOf, type Finding } from './finding';
import { localMidnightUtc, nextDate } from './site-clock';

export interface StationGapFacts {
  /** The site the alert is filed on. */
  siteId: string;
  timeZone: string;
  station: { id: number; name: string };
  gap: { from: string; to: string; days: number; late: boolean };
  /** Names of the sites whose budgets use the station. */
  sitesUsing: string[];
}

export function stationGapFinding(facts: StationGapFacts): Finding {
  const { gap, station } = facts;
  const conditionKey = conditionKeyOf(facts.siteId, 'weather', 'station-gap', undefined, `station-${station.id}`);
  const start = localMidnightUtc(gap.from, facts.timeZone);
  const end = localMidnightUtc(nextDate(gap.to), facts.timeZone);
  const span = gap.from === gap.to ? gap.from : `${gap.from} to ${gap.to}`;
  const what = gap.late
    ? `has sent no weather since ${gap.from} (${gap.days} day${gap.days === 1 ? '' : 's'} late)`
    : `is missing ETo or rain for ${span} (${gap.days} day${gap.days === 1 ? '' : 's'})`;
  const shown = facts.sitesUsing.slice(0, 5).join(', ') + (facts.sitesUsing.length > 5 ? ', …' : '');
  return {
    key: findingKeyOf(conditionKey, start),
    conditionKey,
    siteId: facts.siteId,
    kind: 'weather',
    subKind: 'station-gap',
    scope: `station-${station.id}`,
    periodStartUtc: start,
    periodEndUtc: end,
    detectedAtUtc: end,
    ongoing: gap.late,
    severity: gap.late || gap.days >= 3 ? 'act-soon' : 'watch',
    evidence: { missingDays: gap.days, sitesUsingStation: facts.sitesUsing.length },
    series: [],
    waterLostGal: null,
    moneyLost: null,
    explanation:
      `Weather station "${station.name}" ${what}. ${facts.sitesUsing.length} site budget(s) use it (${shown}): ` +
      'until the days are uploaded or fetched (Weather → the station), those budgets are estimated or cover ' +
      "fewer days, and overspend can be missed. Entering the station's monthly normals also fills such gaps.",
  };
}
