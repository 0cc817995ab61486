import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { RepairTimeRow } from '@shared/alerts/alert-dto';
import { describeApiError } from '../../core/http/api-error';
import { AlertsApi } from '../alerts-api';

const iso = (d: Date) => d.toISOString().slice(0, 10);

/**
 * Time from alert to verified repair, per site and per who resolved it: alerts resolved as fixed, counted by what the
 * meter said after the repair (verified, not confirmed, still being checked).
 */
@Component({
  selector: 'rm-repair-times',
  host: { class: 'rm-page' },
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
  ],
  template: `
    <a mat-button routerLink="/alerts"><mat-icon>arrow_back</mat-icon> All alerts</a>
    <header class="rm-page-header"><h1>Repairs verified by the meter</h1></header>
    <p class="caution">
      Alerts resolved as “fixed”, by when they were first flagged. A repair counts as verified when the first three
      nights (or runs) after it are back to the site's usual figures; days are counted from the first flag.
    </p>
    <div class="controls">
      <mat-form-field>
        <mat-label>Flagged from</mat-label>
        <input matInput type="date" [ngModel]="from()" (ngModelChange)="from.set($event)" name="from" />
      </mat-form-field>
      <mat-form-field>
        <mat-label>Flagged until</mat-label>
        <input matInput type="date" [ngModel]="to()" (ngModelChange)="to.set($event)" name="to" />
      </mat-form-field>
    </div>
    <div class="rm-progress-slot">
      @if (times.isLoading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading repair times" />
      }
    </div>
    @if (loadError(); as message) {
      <p class="rm-form-error" role="alert">{{ message }}</p>
    }
    @if (times.hasValue()) {
      @for (group of groups(); track group.title) {
        <h2>{{ group.title }}</h2>
        @if (group.rows.length === 0) {
          <p>No alert flagged in this period was resolved as fixed.</p>
        } @else {
          <table class="card-table" [attr.aria-label]="group.title">
            <thead>
              <tr>
                <th scope="col">{{ group.column }}</th>
                <th scope="col" class="num">Verified by data</th>
                <th scope="col" class="num">Not confirmed</th>
                <th scope="col" class="num">Being checked</th>
                <th scope="col" class="num">Median days to repair</th>
                <th scope="col" class="num">Median days to verified</th>
              </tr>
            </thead>
            <tbody>
              @for (r of group.rows; track r.key) {
                <tr>
                  <th scope="row" [attr.data-label]="group.column">{{ r.label }}</th>
                  <td class="num" data-label="Verified by data">{{ r.verified }}</td>
                  <td class="num" data-label="Not confirmed">{{ r.notVerified }}</td>
                  <td class="num" data-label="Being checked">{{ r.watching }}</td>
                  <td class="num" data-label="Median days to repair">{{ days(r.medianDaysToRepair) }}</td>
                  <td class="num" data-label="Median days to verified">{{ days(r.medianDaysToVerified) }}</td>
                </tr>
              }
            </tbody>
          </table>
        }
      }
    }
  `,
  styleUrl: '../../shared/card-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RepairTimes {
  private readonly api = inject(AlertsApi);
  protected readonly from = signal(iso(new Date(Date.now() - 365 * 86_400_000)));
  protected readonly to = signal(iso(new Date()));
  protected readonly times = rxResource({
    params: () => ({ from: this.from(), to: this.to() }),
    stream: ({ params }) => this.api.repairTimes(params.from, params.to),
  });
  protected readonly loadError = computed(() => {
    const error = this.times.error();
    return error ? describeApiError(error, 'The repair times could not be loaded.').message : null;
  });
  protected readonly groups = computed<{ title: string; column: string; rows: RepairTimeRow[] }[]>(() => {
    const t = this.times.hasValue() ? this.times.value() : null;
    return [
      { title: 'Per site', column: 'Site', rows: t?.bySite ?? [] },
      { title: 'Per contractor (who resolved it)', column: 'Resolved by', rows: t?.byResolver ?? [] },
    ];
  });

  protected days(v: number | null): string {
    return v === null ? '—' : `${v.toFixed(1)} d`;
  }
}
