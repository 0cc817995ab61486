import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { addMonths } from '@shared/portfolio/period';
import { describeApiError } from '../../core/http/api-error';
import { lastCompleteMonth } from '../../shared/period-picker/period-picker';
import { MonthlyTable } from '../monthly-table/monthly-table';
import { ReadingsApi } from '../readings-api';

/** `/sites/:id/monthly`: twelve months of use against budget ending at a chosen month, with its CSV. */
@Component({
  selector: 'rm-site-monthly',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MonthlyTable],
  template: `
    <section class="rm-page">
      <header class="rm-page-header">
        <h2 id="monthly-title">Monthly table</h2>
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>Last month shown</mat-label>
          <input matInput type="month" [value]="to()" (change)="chooseMonth($any($event.target).value)" />
        </mat-form-field>
        <a mat-stroked-button [href]="csvUrl()" download><mat-icon>download</mat-icon> Export CSV</a>
      </header>
      <div class="rm-progress-slot">
        @if (monthly.isLoading()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading the monthly table" />
        }
      </div>
      @if (error(); as message) {
        <div class="rm-state rm-state-error" role="alert">
          <mat-icon aria-hidden="true">cloud_off</mat-icon>
          <p>{{ message }}</p>
          <button mat-stroked-button type="button" (click)="monthly.reload()">Try again</button>
        </div>
      } @else if (monthly.hasValue()) {
        <p class="hint">
          {{ from() }} to {{ to() }} · volumes in US gallons, months on the site's calendar ({{
            monthly.value().site.timeZone
          }}).
        </p>
        <rm-monthly-table [months]="monthly.value().months" [totals]="monthly.value().totals" />
      } @else {
        <div class="rm-state"><p>Loading the monthly table…</p></div>
      }
    </section>
  `,
  styles: `
    .hint {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      margin: 8px 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteMonthly {
  private readonly api = inject(ReadingsApi);

  /** Route parameter. */
  readonly id = input.required<string>();
  private readonly siteId = computed(() => Number(this.id()));
  protected readonly to = signal(lastCompleteMonth().from.slice(0, 7));
  protected readonly from = computed(() => addMonths(this.to(), -11));
  protected readonly monthly = rxResource({
    params: () => ({ id: this.siteId(), from: this.from(), to: this.to() }),
    stream: ({ params }) => this.api.monthly(params.id, params.from, params.to),
  });
  protected readonly csvUrl = computed(() => this.api.monthlyCsvUrl(this.siteId(), this.from(), this.to()));
  protected readonly error = computed(() =>
    this.monthly.error()
      ? describeApiError(this.monthly.error(), 'The monthly table could not be loaded.').message
      : null,
  );

  protected chooseMonth(value: string): void {
    if (/^\d{4}-(0[1-9]|1[0-2])$/.test(value)) this.to.set(value);
  }
}
