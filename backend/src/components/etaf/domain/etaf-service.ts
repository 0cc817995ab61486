import type { DataSource } from 'typeorm';
import { defaultEtafSetting, etafHistogram, isPeer, median } from '@shared/etaf/achieved-etaf';
import {
  ETAF_BASIS_LABELS,
  ETAF_METHOD,
  type EtafReportDto,
  type EtafRowDto,
  type EtafSettingDto,
  type EtafSettingInput,
  type EtafSort,
  type SiteEtafStandingDto,
} from '@shared/etaf/etaf-dto';
import { etafRows, sortEtafRows, type EtafSiteFigures } from '@shared/etaf/etaf-ranking';
import { addMonths, daysInMonth, monthsBetween } from '@shared/portfolio/period';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { BudgetCache } from '../../budgets/domain/budget-cache';
import type { SiteRecord } from '../../sites/data/sites-repository';
import type { SitesService } from '../../sites/domain/sites-service';
import type { EtafFilter, EtafRepository, EtafSiteRow } from '../data/etaf-repository';

export const ETAF_MAX_MONTHS = 24;

export interface EtafQuery extends EtafFilter {
  from?: string;
  to?: string;
  page: number;
  pageSize: number;
  sort: EtafSort;
  dir: 'asc' | 'desc';
}

/**
 * Achieved ETAF over every site the user's organisation sees, for every role: it only shows aggregates the user
 * may already read on each site. Allowed ETAF is a per-site setting changed with `edit` access.
 */
export class EtafService {
  constructor(
    private readonly db: DataSource,
    private readonly repo: EtafRepository,
    private readonly sites: SitesService,
    private readonly budgetCache: BudgetCache,
    private readonly audit: AuditRepository,
  ) {}

  async setting(principal: Principal, siteId: number): Promise<EtafSettingDto> {
    return this.allowedFor(await this.sites.requireLevel(principal, siteId, 'read'));
  }

  /** The site's allowed ETAF (saved, or from its kind); the caller has checked access. */
  async allowedFor(site: Pick<SiteRecord, 'id' | 'kind'>): Promise<EtafSettingDto> {
    const saved = await this.repo.setting(site.id);
    if (saved)
      return {
        siteId: site.id,
        allowedEtaf: saved.allowedEtaf,
        basis: saved.basis,
        isDefault: false,
        source: `Set for this site: ${ETAF_BASIS_LABELS[saved.basis]}`,
        updatedAt: saved.updatedAt.toISOString(),
      };
    const d = defaultEtafSetting(site.kind);
    return {
      siteId: site.id,
      ...d,
      isDefault: true,
      source: `From the kind of site: ${d.basis}, MWELO 2015 § 492.4`,
      updatedAt: null,
    };
  }

  async saveSetting(principal: Principal, siteId: number, input: EtafSettingInput): Promise<EtafSettingDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'edit');
    const before = await this.allowedFor(site);
    await this.db.transaction(async (em) => {
      await this.repo.saveSetting(em, siteId, input, principal.userId);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: site.organisationId,
        entity: 'site',
        entityId: siteId,
        action: 'etaf-setting',
        changes: { allowedEtaf: [before.allowedEtaf, input.allowedEtaf], basis: [before.basis, input.basis] },
      });
    });
    return this.allowedFor(site);
  }

  async report(principal: Principal, q: EtafQuery, today = new Date()): Promise<EtafReportDto> {
    const { from, to } = period(q, today);
    const rows = await this.rows(principal, q, from, to);
    const sorted = sortEtafRows(rows, q.sort, q.dir);
    const ranked = rows.filter((r) => r.rank !== null);
    return {
      from,
      to,
      items: sorted.slice(q.page * q.pageSize, (q.page + 1) * q.pageSize),
      total: sorted.length,
      page: q.page,
      pageSize: q.pageSize,
      histogram: etafHistogram(ranked.map((r) => r.achievedEtaf!)),
      summary: {
        sites: rows.length,
        ranked: ranked.length,
        medianEtaf: median(ranked.map((r) => r.achievedEtaf!)),
        overAllowance: ranked.filter((r) => (r.percentOfAllowance ?? 0) > 100).length,
      },
      method: ETAF_METHOD,
    };
  }

  /** One site among the sites its viewer can see: its row, and the distribution of its comparable sites. */
  async standing(
    principal: Principal,
    siteId: number,
    q: { from?: string; to?: string },
  ): Promise<SiteEtafStandingDto> {
    const site = await this.sites.requireLevel(principal, siteId, 'read');
    const { from, to } = period(q, new Date());
    const rows = await this.rows(principal, {}, from, to);
    const row = rows.find((r) => r.siteId === siteId);
    if (!row) throw AppError.notFound('Site');
    const peers = rows.filter((r) => r.rank !== null && isPeer(row, r));
    return {
      from,
      to,
      row,
      peers: {
        label: `${peers.length} ${peers.length === 1 ? 'site' : 'sites'} of the same kind with ETo within ±10 %`,
        count: peers.length,
        medianEtaf: median(peers.map((p) => p.achievedEtaf!)),
        histogram: etafHistogram(peers.map((p) => p.achievedEtaf!)),
      },
      setting: await this.allowedFor(site),
      method: ETAF_METHOD,
    };
  }

  private async rows(principal: Principal, f: EtafFilter, from: string, to: string): Promise<EtafRowDto[]> {
    const months = monthsBetween(`${from}-01`, `${to}-01`);
    const ids = await this.repo.visibleSiteIds(principal.organisationId, f);
    // ETo comes from the monthly budget cache: fill what is missing or stale first (with the asker's access).
    await this.budgetCache.ensure(principal, ids, months);
    const periodDays = months.reduce((s, m) => s + daysInMonth(m), 0);
    const raw = await this.repo.siteRows(principal.organisationId, f, from, to);
    return etafRows(raw.map((r) => figuresOf(r, periodDays)));
  }
}

function figuresOf(r: EtafSiteRow, periodDays: number): EtafSiteFigures {
  const setting = r.setting ?? defaultEtafSetting(r.siteKind);
  return {
    siteId: r.siteId,
    siteName: r.siteName,
    siteKind: r.siteKind,
    organisationName: r.organisationName,
    tags: r.tags,
    landscapeAreaFt2: r.landscapeAreaFt2,
    specialLandscapeAreaFt2: r.specialLandscapeAreaFt2,
    useGal: r.useGal,
    etoIn: r.etoMm === null ? null : r.etoMm / 25.4,
    meteredDays: r.meteredDays,
    periodDays,
    allowedEtaf: setting.allowedEtaf,
    allowedBasis: setting.basis,
    problem: r.budgetProblem,
  };
}

/** Whole months; by default the twelve months before the current one. */
function period(q: { from?: string; to?: string }, today: Date): { from: string; to: string } {
  const to = q.to ?? addMonths(today.toISOString().slice(0, 7), -1);
  const from = q.from ?? addMonths(to, -11);
  if (to < from) throw AppError.invalid('to', `${to} is before ${from}`);
  if (monthsBetween(`${from}-01`, `${to}-01`).length > ETAF_MAX_MONTHS)
    throw AppError.invalid('to', `at most ${ETAF_MAX_MONTHS} months at a time`);
  return { from, to };
}
