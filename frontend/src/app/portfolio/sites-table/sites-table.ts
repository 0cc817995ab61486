import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { SortDirection } from '@shared/api/page';
import {
  PORTFOLIO_SORTS,
  RECENT_DATA_DAYS,
  type PortfolioRow,
  type PortfolioSort,
} from '@shared/portfolio/portfolio-dto';
import { formatVolume } from '@shared/units/format-quantity';
import { Sparkline } from '../sparkline/sparkline';
import { dataAge } from './data-age';

const ALL_COLUMNS = ['siteName', 'useGallons', 'budgetGallons', 'percentOfBudget', 'trend', 'openAlerts', 'lastDataAt'];
const PHONE_COLUMNS = ['siteName', 'percentOfBudget', 'lastDataAt'];

/** The portfolio's sites, one row each; display only: sorting and paging are emitted for the page to fetch. */
@Component({
  selector: 'rm-sites-table',
  imports: [
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatIconModule,
    RouterLink,
    Sparkline,
  ],
  templateUrl: './sites-table.html',
  styleUrl: './sites-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SitesTable {
  readonly rows = input.required<PortfolioRow[]>();
  readonly total = input.required<number>();
  readonly pageIndex = input.required<number>();
  readonly pageSize = input.required<number>();
  readonly sort = input.required<PortfolioSort>();
  readonly direction = input.required<SortDirection>();
  readonly loading = input(false);
  readonly phone = input(false);
  readonly now = input(Date.now());
  /** The period, carried into the site overview link. */
  readonly linkQuery = input<Record<string, string>>({});
  readonly sortChange = output<{ sort: PortfolioSort; dir: SortDirection }>();
  readonly pageChange = output<{ pageIndex: number; pageSize: number }>();

  protected readonly columns = computed(() => (this.phone() ? PHONE_COLUMNS : ALL_COLUMNS));
  protected readonly pageSizeOptions = [10, 25, 50, 100];

  protected gallons(value: number | null): string {
    return value === null ? '—' : formatVolume(value, 'gal');
  }

  protected percent(value: number | null): string {
    return value === null ? 'no budget' : `${Math.round(value).toLocaleString('en-US')} %`;
  }

  /** Bar width: 100 % of budget fills three quarters, so overruns up to 133 % still show. */
  protected barWidth(value: number | null): number {
    return value === null ? 0 : Math.min(100, value * 0.75);
  }

  protected age(row: PortfolioRow): string {
    return dataAge(row.lastDataAt, this.now());
  }

  protected stale(row: PortfolioRow): boolean {
    return !row.lastDataAt || this.now() - Date.parse(row.lastDataAt) > RECENT_DATA_DAYS * 86_400_000;
  }

  protected trend(row: PortfolioRow): number[] {
    return row.trend.map((t) => t.gallons);
  }

  protected trendLabel(row: PortfolioRow): string {
    const t = row.trend;
    const volumes = t.map((m) => formatVolume(m.gallons, 'gal')).join(', ');
    return `Use over 12 months, ${t[0]?.month} to ${t.at(-1)?.month}: ${volumes}`;
  }

  protected sortBy(event: Sort): void {
    const sort = PORTFOLIO_SORTS.find((s) => s === event.active);
    this.sortChange.emit(
      sort && event.direction ? { sort, dir: event.direction } : { sort: 'percentOfBudget', dir: 'desc' },
    );
  }

  protected changePage(event: PageEvent): void {
    this.pageChange.emit({ pageIndex: event.pageIndex, pageSize: event.pageSize });
  }
}
