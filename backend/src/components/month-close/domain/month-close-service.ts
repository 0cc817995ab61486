import type { DataSource } from 'typeorm';
import type {
  MonthCloseDto,
  MonthCloseRowDto,
  MonthCloseSort,
  MonthReviewDto,
} from '@shared/month-close/month-close-dto';
import { expectedDaysOf, localDateIn, meteredShare, totalsOf } from '@shared/month-close/month-figures';
import type { SiteDto } from '@shared/sites/site';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { AlertsService } from '../../alerts/domain/alerts-service';
import type { ReadingsService } from '../../readings/domain/readings-service';
import type { SitesService } from '../../sites/domain/sites-service';
import type { MonthReviewsRepository } from '../data/month-reviews-repository';

export interface MonthCloseQuery {
  month: string;
  page: number;
  pageSize: number;
  sort: MonthCloseSort;
  dir: 'asc' | 'desc';
  q?: string;
  tag?: string;
}

const CLOSING_ROLES = new Set(['admin', 'manager']);

/**
 * The manager's month close: every site the organisation owns, with the month's use, budget, variance, cost, alerts
 * and metered days, and the review mark a manager leaves on each. Managers and administrators only.
 */
export class MonthCloseService {
  constructor(
    private readonly db: DataSource,
    private readonly sites: SitesService,
    private readonly readings: ReadingsService,
    private readonly alerts: AlertsService,
    private readonly reviews: MonthReviewsRepository,
    private readonly audit: AuditRepository,
  ) {}

  requireClosingRole(principal: Principal): void {
    if (!CLOSING_ROLES.has(principal.role))
      throw AppError.forbidden('The month close is for managers and administrators of the owning organisation.');
  }

  /** The organisation's own sites (shared ones are closed by their owners), filtered like the sites list. */
  async ownedSites(principal: Principal, filter: { q?: string; tag?: string } = {}): Promise<SiteDto[]> {
    const { items } = await this.sites.list(principal, {
      page: 0,
      pageSize: 100_000,
      sort: 'name',
      dir: 'asc',
      q: filter.q,
      tag: filter.tag,
    });
    return items.filter((s) => s.organisationId === principal.organisationId);
  }

  async table(principal: Principal, query: MonthCloseQuery): Promise<MonthCloseDto> {
    this.requireClosingRole(principal);
    const rows = await this.rows(principal, await this.ownedSites(principal, query), query.month);
    const sorted = sortRows(rows, query.sort, query.dir);
    return {
      month: query.month,
      items: sorted.slice(query.page * query.pageSize, (query.page + 1) * query.pageSize),
      total: sorted.length,
      page: query.page,
      pageSize: query.pageSize,
      summary: { sites: rows.length, reviewed: rows.filter((r) => r.review).length, ...totalsOf(rows) },
      canReview: true,
    };
  }

  /** The month-close rows of the given sites (already checked to be the principal's own). */
  async rows(principal: Principal, sites: SiteDto[], month: string): Promise<MonthCloseRowDto[]> {
    const ids = sites.map((s) => s.id);
    const months = await this.readings.monthOfSites(principal, ids, month);
    const alerts = await this.alerts.monthCounts(ids, month);
    const reviews = await this.reviews.ofMonth(ids, month);
    return sites.map((site) => {
      const m = months.get(site.id)!;
      const expectedDays = expectedDaysOf(month, localDateIn(site.timeZone));
      const metered = !m.flags.includes('no-data');
      return {
        siteId: site.id,
        siteName: site.name,
        tags: site.tags,
        timeZone: site.timeZone,
        useGallons: metered ? m.useGallons : null,
        budgetGallons: m.budgetGallons,
        varianceGallons: m.varianceGallons,
        percentOfBudget: m.percentOfBudget,
        cost: m.cost,
        currency: m.currency,
        alertsInMonth: alerts.get(site.id)?.inMonth ?? 0,
        openAlerts: alerts.get(site.id)?.open ?? 0,
        meteredDays: m.meteredDays,
        expectedDays,
        completeness: meteredShare(m.meteredDays, expectedDays),
        budgetProblem: m.budgetProblem,
        review: reviews.get(site.id) ?? null,
      };
    });
  }

  async markReviewed(principal: Principal, siteId: number, month: string, note: string): Promise<MonthReviewDto> {
    this.requireClosingRole(principal);
    const site = await this.sites.requireLevel(principal, siteId, 'edit');
    await this.db.transaction(async (em) => {
      const before = await this.reviews.upsert(em, { siteId, month, userId: principal.userId, note });
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'month-review',
        changes: before === null ? { month, note } : { month, note: [before, note] },
      });
    });
    return (await this.reviews.ofMonth([siteId], month)).get(siteId)!;
  }

  async clearReview(principal: Principal, siteId: number, month: string): Promise<void> {
    this.requireClosingRole(principal);
    const site = await this.sites.requireLevel(principal, siteId, 'edit');
    await this.db.transaction(async (em) => {
      if (!(await this.reviews.delete(em, siteId, month))) throw AppError.notFound('Review');
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'month-review-cleared',
        changes: { month },
      });
    });
  }
}

function sortRows(rows: MonthCloseRowDto[], sort: MonthCloseSort, dir: 'asc' | 'desc'): MonthCloseRowDto[] {
  const key = (r: MonthCloseRowDto): number | string | null => {
    switch (sort) {
      case 'name':
        return r.siteName.toLowerCase();
      case 'percentOfBudget':
        return r.percentOfBudget;
      case 'variance':
        return r.varianceGallons;
      case 'cost':
        return r.cost;
      case 'openAlerts':
        return r.openAlerts;
      case 'reviewed':
        return r.review ? 1 : 0;
    }
  };
  const sign = dir === 'asc' ? 1 : -1;
  return rows
    .map((row) => ({ row, key: key(row) }))
    .sort((a, b) => {
      // Missing values last either way; ties by name, then id.
      if (a.key === null && b.key !== null) return 1;
      if (b.key === null && a.key !== null) return -1;
      if (a.key !== null && b.key !== null && a.key !== b.key) return (a.key < b.key ? -1 : 1) * sign;
      return byName.compare(a.row.siteName, b.row.siteName) || a.row.siteId - b.row.siteId;
    })
    .map((k) => k.row);
}

const byName = new Intl.Collator('en');
