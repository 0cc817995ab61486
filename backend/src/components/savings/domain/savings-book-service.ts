import type { Page } from '@shared/api/page';
import {
  SAVINGS_STANDING_LABELS,
  type SavingsBookRowDto,
  type SavingsBookSort,
  type SavingsProjectDto,
  type SavingsProjectStatus,
  type SavingsReportDto,
} from '@shared/savings/savings-project-dto';
import { AppError, plainReason } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { SitesService } from '../../sites/domain/sites-service';
import type { SavingsProjectsService } from './savings-projects-service';
import type { SavingsReportService } from './savings-report-service';

export interface SavingsBookQuery {
  page: number;
  pageSize: number;
  sort: SavingsBookSort;
  dir: 'asc' | 'desc';
  q?: string;
  /** mine: projects written by members of the user's organisation; all: every project on a visible site. */
  scope?: 'mine' | 'all';
  status?: SavingsProjectStatus;
}

/** Reports computed at once; each reads a year or two of weather and use. */
const CONCURRENCY = 4;

/**
 * The savings book: every project the user can see across sites (a contractor's own by default), each with the
 * water and money saved to date and how its verdict stands.
 */
export class SavingsBookService {
  constructor(
    private readonly sites: SitesService,
    private readonly projects: SavingsProjectsService,
    private readonly reports: SavingsReportService,
  ) {}

  async book(principal: Principal, q: SavingsBookQuery): Promise<Page<SavingsBookRowDto>> {
    const scope = q.scope ?? (principal.role === 'contractor' ? 'mine' : 'all');
    const visible = await this.sites.visibleRecords(principal);
    const text = q.q?.toLowerCase();
    const projects = (await this.projects.ofSites(principal, visible, scope === 'mine')).filter(
      (p) =>
        (!q.status || p.status === q.status) &&
        (!text || p.title.toLowerCase().includes(text) || p.siteName.toLowerCase().includes(text)),
    );
    const page = <T>(xs: T[]): T[] => xs.slice(q.page * q.pageSize, (q.page + 1) * q.pageSize);
    // Ordering by water saved needs every report; other orders need only the page's.
    const items =
      q.sort === 'savedGal'
        ? page(bySaved(await this.rows(principal, projects), q.dir))
        : await this.rows(principal, page(sortProjects(projects, q.sort, q.dir)));
    return { items, total: projects.length, page: q.page, pageSize: q.pageSize };
  }

  private async rows(principal: Principal, projects: SavingsProjectDto[]): Promise<SavingsBookRowDto[]> {
    const out: SavingsBookRowDto[] = [];
    for (let i = 0; i < projects.length; i += CONCURRENCY)
      out.push(...(await Promise.all(projects.slice(i, i + CONCURRENCY).map((p) => this.row(principal, p)))));
    return out;
  }

  private async row(principal: Principal, project: SavingsProjectDto): Promise<SavingsBookRowDto> {
    let report: SavingsReportDto;
    try {
      report = await this.reports.report(principal, project.id);
    } catch (error) {
      if (!(error instanceof AppError) || error.code !== 'validation_failed') throw error;
      return {
        project,
        standing: 'waiting',
        standingText: plainReason(error),
        savedGal: null,
        savedPercent: null,
        savedMoney: null,
        currency: null,
        reportedMonths: 0,
      };
    }
    const s = report.savings;
    const standing = s.savedGal <= 0 ? 'no-savings' : report.verdict.canClaimSavings ? 'proven' : 'not-proven';
    return {
      project,
      standing,
      standingText: report.verdict.summary || SAVINGS_STANDING_LABELS[standing],
      savedGal: s.savedGal,
      savedPercent: s.savedPercent,
      savedMoney: s.savedMoney,
      currency: s.currency,
      reportedMonths: s.periods.length,
    };
  }
}

function bySaved(rows: SavingsBookRowDto[], dir: 'asc' | 'desc'): SavingsBookRowDto[] {
  const sign = dir === 'asc' ? 1 : -1;
  // Projects still waiting for data go last either way.
  return [...rows].sort((a, b) =>
    a.savedGal === null || b.savedGal === null
      ? Number(a.savedGal === null) - Number(b.savedGal === null)
      : sign * (a.savedGal - b.savedGal),
  );
}

function sortProjects(rows: SavingsProjectDto[], sort: SavingsBookSort, dir: 'asc' | 'desc'): SavingsProjectDto[] {
  const key = (p: SavingsProjectDto): string =>
    sort === 'title' ? p.title.toLowerCase() : sort === 'site' ? p.siteName.toLowerCase() : p.installedOn;
  const sign = dir === 'asc' ? 1 : -1;
  return [...rows].sort((a, b) => {
    const x = key(a);
    const y = key(b);
    return (x < y ? -sign : x > y ? sign : 0) || b.id - a.id;
  });
}
