import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { monthsBetween, resolvePeriod } from '@shared/portfolio/period';
import { PORTFOLIO_PERIODS, type PortfolioPeriod } from '@shared/portfolio/portfolio-dto';
import { formatVolume } from '@shared/units/format-quantity';
import { describeApiError } from '../../core/http/api-error';
import { lastCompleteMonth, PeriodPicker, type PeriodValue } from '../../shared/period-picker/period-picker';
import { DailyChart } from '../daily-chart/daily-chart';
import { FlowGrid } from '../flow-grid/flow-grid';
import { ReadingsApi } from '../readings-api';

/** `/sites/:id/overview`: a period's key figures, daily use against budget and the hour-by-day flow grid. */
@Component({
  selector: 'rm-site-overview',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, PeriodPicker, DailyChart, FlowGrid],
  templateUrl: './site-overview.html',
  styleUrl: './site-overview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteOverview {
  private readonly api = inject(ReadingsApi);
  private readonly route = inject(ActivatedRoute);
  protected readonly siteId = Number(this.route.snapshot.paramMap.get('id'));

  protected readonly period = signal<PeriodValue>(this.initialPeriod());
  /** The grid shows one month; it follows the period's last month until the user picks another. */
  protected readonly gridMonth = linkedSignal(() => this.period().to.slice(0, 7));
  protected readonly gridMonths = computed(() => monthsBetween(this.period().from, this.period().to));

  protected readonly overview = rxResource({
    params: () => this.period(),
    stream: ({ params }) => this.api.overview(this.siteId, params.from, params.to),
  });
  protected readonly grid = rxResource({
    params: () => this.gridMonth(),
    stream: ({ params }) => this.api.hourlyGrid(this.siteId, params),
  });

  protected readonly overviewError = computed(() =>
    errorOf(this.overview.error(), 'The overview could not be loaded.'),
  );
  protected readonly gridError = computed(() => errorOf(this.grid.error(), 'The flow grid could not be loaded.'));
  protected readonly gridHasData = computed(() =>
    this.grid.hasValue() ? this.grid.value().days.some((d) => d.hours.some((h) => h !== null)) : false,
  );

  protected gallons(value: number | null): string {
    return value === null ? '—' : formatVolume(value, 'gal');
  }

  protected percent(value: number | null): string {
    return value === null ? 'no budget' : `${Math.round(value).toLocaleString('en-US')} %`;
  }

  protected choosePeriod(value: PeriodValue): void {
    this.period.set(value);
  }

  protected chooseGridMonth(month: string): void {
    this.gridMonth.set(month);
  }

  private initialPeriod(): PeriodValue {
    const q = this.route.snapshot.queryParamMap;
    const kind = (PORTFOLIO_PERIODS as readonly string[]).includes(q.get('period') ?? '')
      ? (q.get('period') as PortfolioPeriod)
      : 'month';
    if (!q.get('from')) return lastCompleteMonth();
    const p = resolvePeriod(kind, q.get('from')!, q.get('from')!, q.get('to') ?? undefined);
    return { kind, from: p.from, to: p.to };
  }
}

function errorOf(error: unknown, fallback: string): string | null {
  return error ? describeApiError(error, fallback).message : null;
}
