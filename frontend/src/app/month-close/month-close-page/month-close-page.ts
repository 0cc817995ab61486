import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { MonthCloseRowDto, MonthCloseSort } from '@shared/month-close/month-close-dto';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { LoadError } from '../../shared/load-error/load-error';
import { MonthStepper } from '../../shared/month-stepper/month-stepper';
import { lastCompleteMonth } from '../../shared/period-picker/period-picker';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';
import { SitesApi } from '../../sites/sites-api';
import { BoardPackets } from '../board-packets/board-packets';
import { MonthCloseApi } from '../month-close-api';
import { askPacket } from '../packet-dialog/packet-dialog';
import { askReview } from '../review-dialog/review-dialog';

/**
 * `/month-close`: a manager's review of a month across the organisation's sites — use, budget, variance, cost,
 * alerts and how complete the data is — with a review mark per site and the month's board packets.
 */
@Component({
  selector: 'rm-month-close-page',
  imports: [
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    LoadError,
    MonthStepper,
    BoardPackets,
  ],
  templateUrl: './month-close-page.html',
  styleUrl: './month-close-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MonthClosePage {
  private readonly api = inject(MonthCloseApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);
  protected readonly units = inject(UnitSystemStore);

  protected readonly latest = lastCompleteMonth().from.slice(0, 7);
  protected readonly month = signal(this.latest);
  protected readonly tag = signal<string | null>(null);
  protected readonly sort = signal<MonthCloseSort>('name');
  protected readonly dir = signal<'asc' | 'desc'>('asc');
  protected readonly packetsVersion = signal(0);
  protected readonly columns = ['site', 'use', 'budget', 'variance', 'cost', 'alerts', 'data', 'review'];

  protected readonly table = rxResource({
    params: () => ({
      month: this.month(),
      tag: this.tag(),
      sort: this.sort(),
      dir: this.dir(),
      page: 0,
      pageSize: 200,
    }),
    stream: ({ params }) => this.api.table(params),
  });
  protected readonly tags = rxResource({ stream: () => this.sitesApi.tags() });
  protected readonly error = computed(() =>
    this.table.error() ? describeApiError(this.table.error(), 'The month could not be loaded.').message : null,
  );
  protected readonly monthLabel = computed(() =>
    new Intl.DateTimeFormat('en-US', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
      new Date(`${this.month()}-01T00:00:00Z`),
    ),
  );

  constructor() {
    void this.units.ensureLoaded();
  }

  protected chooseMonth(month: string): void {
    this.month.set(month);
  }

  protected onSort(sort: Sort): void {
    this.sort.set(sort.direction ? (sort.active as MonthCloseSort) : 'name');
    this.dir.set(sort.direction || 'asc');
  }

  protected volume(gallons: number | null): string {
    return gallons === null ? '—' : this.units.volume(gallons);
  }

  protected variance(gallons: number | null): string {
    if (gallons === null) return '—';
    return `${gallons > 0 ? '+' : gallons < 0 ? '−' : ''}${this.units.volume(Math.abs(gallons))}`;
  }

  protected money(amount: number | null, currency: string | null): string {
    if (amount === null || currency === null) return '—';
    return new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(amount);
  }

  protected percent(value: number | null): string {
    return value === null ? '—' : `${Math.round(value)} %`;
  }

  protected reviewedOn(iso: string): string {
    return new Intl.DateTimeFormat('en-US', { month: 'short', day: 'numeric', year: 'numeric' }).format(new Date(iso));
  }

  protected async review(row: MonthCloseRowDto): Promise<void> {
    const note = await askReview(this.dialog, {
      siteName: row.siteName,
      monthLabel: this.monthLabel(),
      note: row.review?.note ?? '',
    });
    if (note === null) return;
    try {
      await firstValueFrom(this.api.markReviewed(row.siteId, this.month(), note));
      this.table.reload();
    } catch (err) {
      this.snack.open(describeApiError(err, 'The review could not be saved.').message, 'OK', { duration: 8000 });
    }
  }

  protected async newPacket(): Promise<void> {
    if (!this.table.hasValue()) return;
    const choice = await askPacket(this.dialog, { monthLabel: this.monthLabel(), sites: this.table.value().items });
    if (!choice) return;
    try {
      await firstValueFrom(this.api.startPacket({ month: this.month(), ...choice }));
      this.packetsVersion.update((v) => v + 1);
    } catch (err) {
      this.snack.open(describeApiError(err, 'The packet could not be started.').message, 'OK', { duration: 8000 });
    }
  }
}
