import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import type { ComplianceRowDto, ComplianceSort } from '@shared/reports/compliance-report-dto';
import { WORKLIST_GROUP_LABELS } from '@shared/reports/worklist';
import { SITE_KINDS, SITE_KIND_LABELS, type SiteKind } from '@shared/sites/site';
import { firstValueFrom } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { SitesApi } from '../../sites/sites-api';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';
import { askNotice } from '../notice-dialog/notice-dialog';
import { showNoticeHistory } from '../notice-history/notice-history';
import { ReportsApi, type ComplianceQuery } from '../reports-api';

const lastMonth = () => {
  const now = new Date();
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1)).toISOString().slice(0, 7);
};

/**
 * `/reports`: the budget worklist (auditors, managers, admins) — sites needing a look first, each in its group —
 * and the way into the savings book and a site's savings projects.
 */
@Component({
  selector: 'rm-compliance-page',
  imports: [
    DecimalPipe,
    RouterLink,
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
  ],
  templateUrl: './compliance-page.html',
  styleUrl: './compliance-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CompliancePage {
  private readonly api = inject(ReportsApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly auth = inject(AuthStore);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);
  private readonly router = inject(Router);
  protected readonly units = inject(UnitSystemStore);

  protected readonly kinds = SITE_KINDS;
  protected readonly kindLabels: Record<string, string> = SITE_KIND_LABELS;
  protected readonly groupLabels: Record<string, string> = WORKLIST_GROUP_LABELS;
  protected readonly columns = [
    'rank',
    'name',
    'group',
    'use',
    'budget',
    'percent',
    'alerts',
    'completeness',
    'trend',
    'notice',
  ];
  protected readonly canRank = computed(() =>
    ['admin', 'manager', 'auditor'].includes(this.auth.user()?.organisation.role ?? ''),
  );

  protected readonly year = signal(Number(lastMonth().slice(0, 4)));
  protected readonly month = signal<string | null>(lastMonth());
  protected readonly kind = signal<SiteKind | null>(null);
  protected readonly tag = signal<string | null>(null);
  protected readonly owner = signal<number | null>(null);
  protected readonly page = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly sort = signal<ComplianceSort>('rank');
  protected readonly dir = signal<'asc' | 'desc'>('asc');
  protected readonly monthsOfYear = computed(() =>
    Array.from({ length: 12 }, (_, i) => `${this.year()}-${String(i + 1).padStart(2, '0')}`),
  );

  protected readonly query = computed<ComplianceQuery>(() => ({
    year: this.year(),
    month: this.month(),
    kind: this.kind(),
    tag: this.tag(),
    owner: this.owner(),
    page: this.page(),
    pageSize: this.pageSize(),
    sort: this.sort(),
    dir: this.dir(),
  }));
  protected readonly ranking = rxResource({
    params: () => (this.canRank() ? this.query() : undefined),
    stream: ({ params }) => this.api.compliance(params),
  });
  protected readonly tags = rxResource({ stream: () => this.sitesApi.tags() });
  protected readonly sites = rxResource({
    stream: () => this.sitesApi.list({ page: 0, pageSize: 200, sort: 'name', dir: 'asc', q: '', tag: '', kind: '' }),
  });
  protected readonly error = computed(() => {
    const err = this.ranking.error();
    return err ? describeApiError(err, 'The ranking could not be loaded.').message : null;
  });
  protected readonly csvUrl = computed(() => this.api.complianceExportUrl(this.query(), 'csv'));
  protected readonly pdfUrl = computed(() => this.api.complianceExportUrl(this.query(), 'pdf'));

  constructor() {
    void this.units.ensureLoaded();
  }

  protected volume(gallons: number | null): string {
    return gallons === null ? '—' : this.units.volume(gallons);
  }

  protected history(row: ComplianceRowDto): void {
    showNoticeHistory(this.dialog, { siteId: row.siteId, siteName: row.siteName });
  }

  protected setYear(value: number): void {
    if (!Number.isInteger(value) || value < 2000 || value > 2100) return;
    this.year.set(value);
    if (this.month()) this.month.set(`${value}${this.month()!.slice(4)}`);
    this.page.set(0);
  }

  protected filter(apply: () => void): void {
    apply();
    this.page.set(0);
  }

  protected onSort(sort: Sort): void {
    this.sort.set(sort.direction ? (sort.active as ComplianceSort) : 'rank');
    this.dir.set(sort.direction || 'asc');
    this.page.set(0);
  }

  protected onPage(event: PageEvent): void {
    this.page.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
  }

  /** Bar width: 100 % of budget fills two thirds, so overruns up to 150 % still show their size. */
  protected barWidth(row: ComplianceRowDto): number {
    return Math.min(100, ((row.percentOfBudget ?? 0) / 150) * 100);
  }

  protected async notify(row: ComplianceRowDto): Promise<void> {
    const month = this.month() ?? lastMonth();
    const message = await askNotice(this.dialog, {
      siteName: row.siteName,
      month,
      percentOfBudget: row.percentOfBudget,
    });
    if (message === null) return;
    try {
      const sent = await firstValueFrom(this.api.sendNotice(row.siteId, month, message));
      this.snack.open(
        `Notice sent to ${sent.recipients} manager${sent.recipients === 1 ? '' : 's'} of ${row.siteName}.`,
        'OK',
        { duration: 5000 },
      );
      this.ranking.reload();
    } catch (err) {
      this.snack.open(describeApiError(err, 'The notice could not be sent.').message, 'OK', { duration: 8000 });
    }
  }

  protected openSavings(siteId: number | null): void {
    if (siteId) void this.router.navigate(['/reports/sites', siteId, 'savings']);
  }
}
