import type { ComplianceReportDto, ComplianceRowDto, ComplianceSort } from '@shared/reports/compliance-report-dto';
import { percentOfBudget, trendVsLastYear } from '@shared/reports/budget-compliance';
import { rankByPercentOfBudget } from '@shared/reports/compliance-ranking';
import { completenessShare, daysInRange } from '@shared/reports/data-completeness';
import type { SiteKind } from '@shared/sites/site';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import { lastDayOf, type BudgetsService } from '../../budgets/domain/budgets-service';
import type { DailyUseRepository, MonthlyUse } from '../../readings/data/daily-use-repository';
import type { SiteRecord, SitesRepository } from '../../sites/data/sites-repository';
import type { ComplianceNoticesRepository } from '../data/compliance-notices-repository';

export interface ComplianceQuery {
  year: number;
  month?: string;
  kind?: SiteKind;
  tag?: string;
  page: number;
  pageSize: number;
  sort: ComplianceSort;
  dir: 'asc' | 'desc';
}

/** Sites computed at once; each budget reads hydrozones and a year of weather. */
const CONCURRENCY = 8;
const REPORT_ROLES = new Set(['admin', 'manager', 'auditor']);

/**
 * The compliance ranking over every site the user's organisation can see (for a utility's auditor: the sites
 * shared with it). Budgets come from BudgetsService, the same figures as each site's budget and compliance pages.
 */
export class ComplianceService {
  constructor(
    private readonly sitesRepository: SitesRepository,
    private readonly budgets: BudgetsService,
    private readonly dailyUse: DailyUseRepository,
    private readonly notices: ComplianceNoticesRepository,
  ) {}

  requireReportRole(principal: Principal): void {
    if (!REPORT_ROLES.has(principal.role))
      throw AppError.forbidden('Compliance reports are for managers, administrators and auditors.');
  }

  async ranking(principal: Principal, q: ComplianceQuery): Promise<ComplianceReportDto> {
    this.requireReportRole(principal);
    if (q.month && Number(q.month.slice(0, 4)) !== q.year) throw AppError.invalid('month', `must be in ${q.year}`);
    const { rows: sites } = await this.sitesRepository.list(principal.organisationId, {
      page: 0,
      pageSize: 100_000,
      sort: 'name',
      dir: 'asc',
      tag: q.tag,
      kind: q.kind,
    });
    const from = q.month ? `${q.month}-01` : `${q.year}-01-01`;
    const to = q.month ? lastDayOf(q.month) : `${q.year}-12-31`;
    const ids = sites.map((s) => s.id);
    const use = await this.dailyUse.monthly(ids, `${q.year - 1}-01-01`, `${q.year}-12-31`);
    const sent = await this.notices.latest(ids, q.month ?? null, q.year);
    const rows: Omit<ComplianceRowDto, 'rank'>[] = [];
    for (let i = 0; i < sites.length; i += CONCURRENCY) {
      rows.push(
        ...(await Promise.all(
          sites.slice(i, i + CONCURRENCY).map((site) => this.row(principal, site, q, from, to, use, sent)),
        )),
      );
    }
    const ranked = rankByPercentOfBudget(rows);
    const sorted =
      q.sort === 'rank' ? (q.dir === 'asc' ? ranked : [...ranked].reverse()) : sortBy(ranked, q.sort, q.dir);
    return {
      year: q.year,
      month: q.month ?? null,
      period: { from, to },
      basis: q.month
        ? `Metered use in ${q.month} against that month's water budget ` +
          "(hydrozones × ETo, as on each site's budget page)."
        : `Metered use in ${q.year} against the year's maximum applied ` +
          "water allowance (MAWA, as on each site's compliance page).",
      items: sorted.slice(q.page * q.pageSize, (q.page + 1) * q.pageSize),
      total: sorted.length,
      page: q.page,
      pageSize: q.pageSize,
    };
  }

  /** Use and budget of one site for the month (or year), with completeness and last year's use for the same months. */
  async row(
    principal: Principal,
    site: SiteRecord,
    q: { year: number; month?: string },
    from: string,
    to: string,
    use: MonthlyUse[],
    sent: Map<number, Date>,
  ): Promise<Omit<ComplianceRowDto, 'rank'>> {
    const mine = use.filter((u) => u.siteId === site.id);
    const sum = (a: string, b: string) =>
      mine.filter((u) => u.month >= a && u.month <= b).reduce((s, u) => s + u.gallons, 0);
    const lastYear = (m: string) => `${Number(m.slice(0, 4)) - 1}${m.slice(4)}`;
    const fromMonth = from.slice(0, 7);
    const toMonth = to.slice(0, 7);
    const useGal = sum(fromMonth, toMonth);
    const annualUseGal = sum(`${q.year}-01`, `${q.year}-12`);
    // Completeness and trend only over days that have happened in the site's own calendar.
    const today = localDate(site.timeZone);
    const end = to < today ? to : today;
    const expectedDays = from <= end ? daysInRange(from, end) : 0;
    const presentDays = mine
      .filter((u) => u.month >= fromMonth && u.month <= end.slice(0, 7))
      .reduce((s, u) => s + u.days, 0);
    const lastYearUse = mine.some((u) => u.month >= lastYear(fromMonth) && u.month <= lastYear(end.slice(0, 7)))
      ? sum(lastYear(fromMonth), lastYear(end.slice(0, 7)))
      : null;
    const thisYearToDate = sum(fromMonth, end.slice(0, 7));
    let problem: string | null = null;
    let annualMawaGal: number | null = null;
    let budgetGal: number | null = null;
    try {
      annualMawaGal = (await this.budgets.compliance(principal, site.id, q.year, undefined, false)).mawaGallons;
      budgetGal = q.month
        ? (await this.budgets.budget(principal, site.id, q.month, q.month, 'none')).months[0]!.gallons
        : annualMawaGal;
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
      problem = error.message;
    }
    return {
      siteId: site.id,
      siteName: site.name,
      siteKind: site.kind,
      organisationName: site.organisationName,
      tags: site.tags,
      useGal,
      budgetGal,
      percentOfBudget: percentOfBudget(useGal, budgetGal),
      annualUseGal,
      annualMawaGal,
      annualPercentOfMawa: percentOfBudget(annualUseGal, annualMawaGal),
      completeness: completenessShare(Math.min(presentDays, expectedDays), expectedDays),
      presentDays,
      expectedDays,
      trendPercent: trendVsLastYear(thisYearToDate, lastYearUse),
      lastYearUseGal: lastYearUse,
      problem,
      noticeSentAt: sent.get(site.id)?.toISOString() ?? null,
    };
  }
}

function sortBy<T extends ComplianceRowDto>(
  rows: T[],
  sort: Exclude<ComplianceSort, 'rank'>,
  dir: 'asc' | 'desc',
): T[] {
  const key = (r: T): number | string | null =>
    sort === 'name'
      ? r.siteName.toLowerCase()
      : sort === 'completeness'
        ? r.completeness
        : sort === 'trend'
          ? r.trendPercent
          : r.useGal;
  const sign = dir === 'asc' ? 1 : -1;
  return [...rows].sort((a, b) => {
    const x = key(a);
    const y = key(b);
    // Missing values last whichever way the column is sorted.
    if (x === null || y === null) return x === y ? a.rank - b.rank : x === null ? 1 : -1;
    return (x < y ? -sign : x > y ? sign : 0) || a.rank - b.rank;
  });
}

/** Today's date in a time zone, YYYY-MM-DD. */
export function localDate(timeZone: string, at = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(at);
}
