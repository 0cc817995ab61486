import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { rxResource, takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { SortDirection } from '@shared/api/page';
import type { PortfolioCondition, PortfolioDto, PortfolioSort } from '@shared/portfolio/portfolio-dto';
import type { UseAgainstBudget } from '@shared/readings/readings-dto';
import { formatVolume } from '@shared/units/format-quantity';
import { debounceTime, distinctUntilChanged, map } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { lastCompleteMonth, PeriodPicker, type PeriodValue } from '../../shared/period-picker/period-picker';
import { PortfolioApi, type PortfolioQuery } from '../portfolio-api';
import { SitesTable } from '../sites-table/sites-table';

const CONDITIONS: { value: PortfolioCondition; label: string }[] = [
  { value: 'over-budget', label: 'Over budget' },
  { value: 'no-recent-data', label: 'No recent data' },
  { value: 'open-alerts', label: 'Open alerts' },
];

/** Home after sign-in: how the whole portfolio stands against its water budgets, worst sites first. */
@Component({
  selector: 'rm-portfolio-page',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    PeriodPicker,
    SitesTable,
  ],
  templateUrl: './portfolio-page.html',
  styleUrl: './portfolio-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PortfolioPage {
  private readonly api = inject(PortfolioApi);
  protected readonly conditions = CONDITIONS;

  // The monthly review looks at the last complete month first; the picker moves on from there.
  protected readonly period = signal<PeriodValue>(lastCompleteMonth());
  protected readonly sort = signal<PortfolioSort>('percentOfBudget');
  protected readonly dir = signal<SortDirection>('desc');
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly q = signal('');
  protected readonly tag = signal('');
  protected readonly condition = signal<PortfolioCondition | ''>('');
  protected readonly search = new FormControl('', { nonNullable: true });

  private readonly query = computed<PortfolioQuery>(() => ({
    period: this.period().kind,
    from: this.period().from,
    to: this.period().to,
    page: this.pageIndex(),
    pageSize: this.pageSize(),
    sort: this.sort(),
    dir: this.dir(),
    q: this.q(),
    tag: this.tag(),
    condition: this.condition(),
  }));

  protected readonly data = rxResource({
    params: () => this.query(),
    stream: ({ params }) => this.api.portfolio(params),
  });
  protected readonly tags = rxResource({ stream: () => this.api.tags() });
  /** The last answer, kept while the next loads so the page doesn't blink. */
  protected readonly shown = linkedSignal<PortfolioDto | undefined, PortfolioDto | undefined>({
    source: () => (this.data.hasValue() ? this.data.value() : undefined),
    computation: (value, previous) => value ?? previous?.value,
  });
  protected readonly errorMessage = computed(() => {
    const error = this.data.error();
    return error ? describeApiError(error, 'The portfolio could not be loaded.').message : null;
  });
  protected readonly tagOptions = computed(() => (this.tags.hasValue() ? this.tags.value() : []));
  protected readonly phone = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 720px)')
      .pipe(map((s) => s.matches)),
    { initialValue: false },
  );
  protected readonly now = Date.now();
  protected readonly linkQuery = computed(() => ({
    period: this.period().kind,
    from: this.period().from,
    to: this.period().to,
  }));

  constructor() {
    this.search.valueChanges
      .pipe(
        map((t) => t.trim()),
        debounceTime(300),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((text) => this.filterBy(() => this.q.set(text)));
  }

  protected gallons(value: number | null): string {
    return value === null ? '—' : formatVolume(value, 'gal');
  }

  protected percentText(figure: UseAgainstBudget): string {
    return figure.percentOfBudget === null
      ? 'no budget'
      : `${Math.round(figure.percentOfBudget).toLocaleString('en-US')} % of budget`;
  }

  protected money(value: number | null, currency: string | null): string {
    if (value === null) return 'not priced';
    return currency ? new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(value) : value.toFixed(2);
  }

  protected choosePeriod(value: PeriodValue): void {
    this.filterBy(() => this.period.set(value));
  }

  protected filterByTag(tag: string): void {
    this.filterBy(() => this.tag.set(tag));
  }

  protected filterByCondition(condition: PortfolioCondition | ''): void {
    this.filterBy(() => this.condition.set(condition));
  }

  protected sortBy(event: { sort: PortfolioSort; dir: SortDirection }): void {
    this.sort.set(event.sort);
    this.dir.set(event.dir);
    this.pageIndex.set(0);
  }

  protected changePage(event: { pageIndex: number; pageSize: number }): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }

  protected retry(): void {
    this.data.reload();
  }

  private filterBy(change: () => void): void {
    change();
    this.pageIndex.set(0);
  }
}
