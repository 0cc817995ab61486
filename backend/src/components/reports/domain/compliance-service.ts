import type { Page } from '@shared/api/page';
import type {
  ComplianceReportDto,
  ComplianceRowDto,
  ComplianceSort,
  NoticeHistoryDto,
} from '@shared/reports/compliance-report-dto';
import { percentOfBudget, trendVsLastYear } from '@shared/reports/budget-compliance';
import { rankWorklist, WORKLIST_GROUP_LABELS, WORKLIST_GROUPS, worklistGroup } from '@shared/reports/worklist';
import { completenessShare, daysInRange } from '@shared/reports/data-completeness';
import type { SiteKind } from '@shared/sites/site';
import { AppError, plainReason } from '../../../platform/app-error';
import type { AlertsService } from '../../alerts/domain/alerts-service';
import type { SitesService } from '../../sites/domain/sites-service';
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
  /** The owning organisation's id. */
  owner?: number;
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
    private readonly sites: SitesService,
    private readonly budgets: BudgetsService,
    private readonly dailyUse: DailyUseRepository,
    private readonly notices: ComplianceNoticesRepository,
    private readonly alerts: AlertsService,
  ) {}

  requireReportRole(principal: Principal): void {
    if (!REPORT_ROLES.has(principal.role))
      throw AppError.forbidden('Compliance reports are for managers, administrators and auditors.');
  }

  async ranking(principal: Principal, q: ComplianceQuery): Promise<ComplianceReportDto> {
    this.requireReportRole(principal);
    if (q.month && Number(q.month.slice(0, 4)) !== q.year) throw AppError.invalid('month', `must be in ${q.year}`);
    const { rows: visible } = await this.sitesRepository.list(principal.organisationId, {
      page: 0,
      pageSize: 100_000,
      sort: 'name',
      dir: 'asc',
      tag: q.tag,
      kind: q.kind,
    });
    const owners = ownersOf(visible);
    const sites = q.owner ? visible.filter((s) => s.organisationId === q.owner) : visible;
    const from = q.month ? `${q.month}-01` : `${q.year}-01-01`;
    const to = q.month ? lastDayOf(q.month) : `${q.year}-12-31`;
    const ids = sites.map((s) => s.id);
    const context = {
      use: await this.dailyUse.monthly(ids, `${q.year - 1}-01-01`, `${q.year}-12-31`),
      sent: await this.notices.latest(ids, q.month ?? null, q.year),
      alerts: await this.alerts.openCountsVisibleTo(principal.organisationId),
    };
    const rows: Omit<ComplianceRowDto, 'rank'>[] = [];
    for (let i = 0; i < sites.length; i += CONCURRENCY) {
      rows.push(
        ...(await Promise.all(
          sites.slice(i, i + CONCURRENCY).map((site) => this.row(principal, site, { ...q, from, to }, context)),
        )),
      );
    }
    const ranked = rankWorklist(rows);
    const sorted =
      q.sort === 'rank' ? (q.dir === 'asc' ? ranked : [...ranked].reverse()) : sortBy(ranked, q.sort, q.dir);
    return {
      year: q.year,
      month: q.month ?? null,
      period: { from, to },
      basis: basisOf(q, from, to),
      allowanceLabel: q.month
        ? "The month's water budget; for a month not over yet, prorated by the share of its ETo to date."
        : "The year's MAWA; for a year not over yet, prorated by the share of its ETo to date (MAWA to date).",
      owners,
      groups: WORKLIST_GROUPS.map((group) => ({
        group,
        label: WORKLIST_GROUP_LABELS[group],
        count: ranked.filter((r) => r.group === group).length,
      })),
      items: sorted.slice(q.page * q.pageSize, (q.page + 1) * q.pageSize),
      total: sorted.length,
      page: q.page,
      pageSize: q.pageSize,
    };
  }

  /**
   * One site's period to date: use, the allowance to date (prorated by ETo while the period runs), completeness,
   * open alerts, last year's use over the same months, and its worklist group.
   */
  async row(
    principal: Principal,
    site: SiteRecord,
    q: { year: number; month?: string; from: string; to: string },
    context: { use: MonthlyUse[]; sent: Map<number, Date>; alerts: Map<number, number> },
  ): Promise<Omit<ComplianceRowDto, 'rank'>> {
    const { from, to } = q;
    const mine = context.use.filter((u) => u.siteId === site.id);
    const sum = (a: string, b: string) =>
      mine.filter((u) => u.month >= a && u.month <= b).reduce((s, u) => s + u.gallons, 0);
    const lastYear = (m: string) => `${Number(m.slice(0, 4)) - 1}${m.slice(4)}`;
    const fromMonth = from.slice(0, 7);
    const useGal = sum(fromMonth, to.slice(0, 7));
    const annualUseGal = sum(`${q.year}-01`, `${q.year}-12`);
    // Completeness, trend and the allowance only over days that have happened in the site's own calendar.
    const today = localDate(site.timeZone);
    const end = to < today ? to : today;
    const expectedDays = from <= end ? daysInRange(from, end) : 0;
    const presentDays = mine
      .filter((u) => u.month >= fromMonth && u.month <= end.slice(0, 7))
      .reduce((s, u) => s + u.days, 0);
    const lastYearUse = mine.some((u) => u.month >= lastYear(fromMonth) && u.month <= lastYear(end.slice(0, 7)))
      ? sum(lastYear(fromMonth), lastYear(end.slice(0, 7)))
      : null;
    const allowance = await this.allowances(principal, site, q, today);
    const percent = presentDays > 0 ? percentOfBudget(useGal, allowance.budgetGal) : null;
    const completeness = completenessShare(Math.min(presentDays, expectedDays), expectedDays);
    const openAlerts = context.alerts.get(site.id) ?? 0;
    return {
      siteId: site.id,
      siteName: site.name,
      siteKind: site.kind,
      ownerId: site.organisationId,
      organisationName: site.organisationName,
      tags: site.tags,
      group: worklistGroup({
        percentOfBudget: percent,
        presentDays,
        expectedDays,
        completeness,
        openAlerts,
        budgetGal: allowance.budgetGal,
      }),
      openAlerts,
      useGal,
      budgetGal: allowance.budgetGal,
      fullBudgetGal: allowance.fullBudgetGal,
      allowanceShare: allowance.share,
      percentOfBudget: percent,
      annualUseGal,
      annualMawaGal: allowance.annualMawaGal,
      annualAllowanceGal: allowance.annualAllowanceGal,
      annualPercentOfMawa: presentDays > 0 ? percentOfBudget(annualUseGal, allowance.annualAllowanceGal) : null,
      completeness,
      presentDays,
      expectedDays,
      trendPercent: trendVsLastYear(sum(fromMonth, end.slice(0, 7)), lastYearUse),
      lastYearUseGal: lastYearUse,
      problem: allowance.problem,
      noticeSentAt: context.sent.get(site.id)?.toISOString() ?? null,
    };
  }

  /** The period's budget and the year's MAWA, each prorated by ETo to `today` while its period is not over. */
  private async allowances(
    principal: Principal,
    site: SiteRecord,
    q: { year: number; month?: string; from: string; to: string },
    today: string,
  ) {
    const empty = { budgetGal: null, fullBudgetGal: null, share: null, annualMawaGal: null, annualAllowanceGal: null };
    try {
      const mawa = (await this.budgets.compliance(principal, site.id, q.year, undefined, false)).mawaGallons;
      const yearShare = await this.shareToDate(principal, site.id, `${q.year}-01-01`, `${q.year}-12-31`, today);
      const full = q.month
        ? (await this.budgets.budget(principal, site.id, q.month, q.month, 'none')).months[0]!.gallons
        : mawa;
      const share = q.month ? await this.shareToDate(principal, site.id, q.from, q.to, today) : yearShare;
      return {
        budgetGal: share === null ? full : full * share,
        fullBudgetGal: full,
        share,
        annualMawaGal: mawa,
        annualAllowanceGal: yearShare === null ? mawa : mawa * yearShare,
        problem: null,
      };
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
      return { ...empty, problem: plainReason(error) };
    }
  }

  /** Null when the period is wholly past (no proration); 0 when it has not begun. */
  private async shareToDate(
    principal: Principal,
    siteId: number,
    from: string,
    to: string,
    today: string,
  ): Promise<number | null> {
    if (today >= to) return null;
    if (today < from) return 0;
    return (await this.budgets.etoShareToDate(principal, siteId, { from, to, through: today })).share;
  }

  /** Sent notices of one site, newest first (for managers, admins and auditors who can see it). */
  async noticeHistory(
    principal: Principal,
    siteId: number,
    page: { page: number; pageSize: number },
  ): Promise<Page<NoticeHistoryDto>> {
    this.requireReportRole(principal);
    await this.sites.requireLevel(principal, siteId, 'read');
    return { ...(await this.notices.history(siteId, page)), ...page };
  }
}

function ownersOf(sites: SiteRecord[]): { id: number; name: string }[] {
  const owners = new Map(sites.map((s) => [s.organisationId, s.organisationName]));
  return [...owners].map(([id, name]) => ({ id, name })).sort((a, b) => (a.name < b.name ? -1 : 1));
}

function basisOf(q: { year: number; month?: string }, from: string, to: string): string {
  return q.month
    ? `Metered use in ${q.month} so far against that month's water budget (hydrozones × ETo, as on each site's ` +
        'budget page), prorated by ETo to date while the month runs.'
    : `Metered use from ${from} to date against the maximum applied water allowance (MAWA) for ${q.year}, ` +
        `prorated by the share of the year's ETo to date until ${to} (MAWA to date).`;
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
