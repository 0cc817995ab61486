import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { SitesApi } from '../../sites/sites-api';
import { describeApiError } from '../../core/http/api-error';
import type { WatchRunDto, WatchRunNote } from '@shared/watch/watch-dto';
import { WatchApi } from '../watch-api';

/** Administrators: the watch's run history, "run now", and a re-check of a date range. */
@Component({
  selector: 'rm-watch-runs',
  host: { class: 'rm-page' },
  imports: [
    DatePipe,
    MatTableModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  template: `
    <h1>Watch runs</h1>
    <p class="intro">
      The watch checks each site every night after 04:00 site time, reading only sites with new data. Run it now, or
      re-check a range after late uploads (its nights are replayed in order, so each alert keeps the night it would
      first have been seen). Leave the sites empty for all of them. Runs go on in the background; this page follows
      them. Times below are in your browser's zone.
    </p>
    <div class="controls">
      <mat-form-field class="sites"
        ><mat-label>Sites</mat-label
        ><mat-select multiple [value]="chosen()" (selectionChange)="chosen.set($event.value)">
          @for (s of sites(); track s.id) {
            <mat-option [value]="s.id">{{ s.name }}</mat-option>
          }
        </mat-select></mat-form-field
      >
      <button mat-flat-button type="button" [disabled]="busy()" (click)="run()">Run now</button>
      <mat-form-field
        ><mat-label>Re-check from</mat-label
        ><input matInput type="date" [value]="from()" (change)="from.set($any($event.target).value)"
      /></mat-form-field>
      <mat-form-field
        ><mat-label>to</mat-label
        ><input matInput type="date" [value]="to()" (change)="to.set($any($event.target).value)"
      /></mat-form-field>
      <button mat-stroked-button type="button" [disabled]="busy() || !from() || !to()" (click)="run(true)">
        Re-check range
      </button>
    </div>
    @if (busy() || runs.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Working" />
    }
    @if (error(); as message) {
      <p class="error" role="alert">{{ message }}</p>
    }
    <table mat-table [dataSource]="rows()" aria-label="Watch runs">
      <ng-container matColumnDef="started"
        ><th mat-header-cell *matHeaderCellDef>Started</th>
        <td mat-cell *matCellDef="let r">{{ r.startedAt | date: 'medium' }}</td></ng-container
      >
      <ng-container matColumnDef="trigger"
        ><th mat-header-cell *matHeaderCellDef>How</th>
        <td mat-cell *matCellDef="let r">{{ r.trigger }}</td></ng-container
      >
      <ng-container matColumnDef="status"
        ><th mat-header-cell *matHeaderCellDef>Status</th>
        <td mat-cell *matCellDef="let r">
          {{ r.status }}
          @if (r.status === 'running') {
            <mat-progress-bar
              mode="determinate"
              [value]="r.sitesTotal ? (100 * r.sitesDone) / r.sitesTotal : 0"
              [attr.aria-label]="'Sites done: ' + r.sitesDone + ' of ' + r.sitesTotal"
            />
            <span class="progress">{{ r.sitesDone }} of {{ r.sitesTotal }} sites</span>
          }
        </td></ng-container
      >
      <ng-container matColumnDef="seconds"
        ><th mat-header-cell *matHeaderCellDef>Took</th>
        <td mat-cell *matCellDef="let r">{{ seconds(r) }}</td></ng-container
      >
      <ng-container matColumnDef="sites"
        ><th mat-header-cell *matHeaderCellDef>Sites checked / skipped</th>
        <td mat-cell *matCellDef="let r">{{ r.sitesChecked }} / {{ r.sitesSkipped }}</td></ng-container
      >
      <ng-container matColumnDef="alerts"
        ><th mat-header-cell *matHeaderCellDef>Alerts new / updated / back</th>
        <td mat-cell *matCellDef="let r">
          {{ r.alertsRaised }} / {{ r.alertsUpdated }} / {{ r.alertsReopened }}
        </td></ng-container
      >
      <ng-container matColumnDef="mails"
        ><th mat-header-cell *matHeaderCellDef>E-mails</th>
        <td mat-cell *matCellDef="let r">{{ r.mailsQueued }}</td></ng-container
      >
      <ng-container matColumnDef="errors"
        ><th mat-header-cell *matHeaderCellDef>Problems</th>
        <td mat-cell *matCellDef="let r">
          @for (e of r.errors; track $index) {
            <div>{{ e.siteName }}: {{ e.message }}</div>
          } @empty {
            none
          }
        </td></ng-container
      >
      <ng-container matColumnDef="warnings"
        ><th mat-header-cell *matHeaderCellDef>Checked on weaker data</th>
        <td mat-cell *matCellDef="let r">
          @for (w of dataWarnings(r); track $index) {
            <div>{{ w.siteName }}: {{ w.message }}</div>
          }
          @if (setupSites(r); as names) {
            <div class="setup">Not set up for the overspend check (no hydrozones or weather station): {{ names }}</div>
          }
          @if (r.warnings.length === 0) {
            none
          }
        </td></ng-container
      >
      <tr mat-header-row *matHeaderRowDef="columns"></tr>
      <tr mat-row *matRowDef="let row; columns: columns"></tr>
      <tr class="mat-row" *matNoDataRow>
        <td class="mat-cell" [attr.colspan]="columns.length">No runs yet.</td>
      </tr>
    </table>
  `,
  styles: `
    .intro {
      max-width: 70ch;
    }
    .controls {
      display: flex;
      gap: 12px;
      align-items: baseline;
      flex-wrap: wrap;
    }
    table {
      width: 100%;
    }
    .error {
      color: #a3261b;
    }
    .sites {
      min-width: 240px;
    }
    .progress,
    .setup {
      color: #5f6368;
      font-size: 0.85em;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchRuns {
  private readonly api = inject(WatchApi);
  private readonly sitesApi = inject(SitesApi);
  protected readonly columns = [
    'started',
    'trigger',
    'status',
    'seconds',
    'sites',
    'alerts',
    'mails',
    'errors',
    'warnings',
  ];
  protected readonly runs = rxResource({ stream: () => this.api.runs(0, 50) });
  protected readonly rows = computed(() => (this.runs.hasValue() ? this.runs.value().items : []));
  private readonly siteList = rxResource({
    stream: () => this.sitesApi.list({ page: 0, pageSize: 100, sort: 'name', dir: 'asc', q: '', tag: '', kind: '' }),
  });
  protected readonly sites = computed(() => (this.siteList.hasValue() ? this.siteList.value().items : []));
  protected readonly chosen = signal<number[]>([]);
  protected readonly busy = signal(false);
  protected readonly from = signal('');
  protected readonly to = signal('');
  private readonly actionError = signal<string | null>(null);
  protected readonly error = computed(
    () =>
      this.actionError() ??
      (this.runs.error() ? describeApiError(this.runs.error(), 'The runs could not be loaded.').message : null),
  );

  constructor() {
    // While a run is going, follow its progress.
    let timer: ReturnType<typeof setTimeout> | undefined;
    effect(() => {
      clearTimeout(timer);
      if (this.rows().some((r) => r.status === 'running')) timer = setTimeout(() => this.runs.reload(), 2000);
    });
    inject(DestroyRef).onDestroy(() => clearTimeout(timer));
  }

  /** Warnings about data (estimated or partial budgets, checks skipped), one line each. */
  protected dataWarnings(r: WatchRunDto): WatchRunNote[] {
    return r.warnings.filter((w) => !w.setupOnly);
  }

  /** Sites simply not set up for overspend yet, as one line of names. */
  protected setupSites(r: WatchRunDto): string {
    const names = r.warnings.filter((w) => w.setupOnly).map((w) => w.siteName);
    return names.length > 8 ? `${names.slice(0, 8).join(', ')} and ${names.length - 8} more` : names.join(', ');
  }

  protected seconds(r: { startedAt: string; finishedAt: string | null }): string {
    return r.finishedAt ? `${((Date.parse(r.finishedAt) - Date.parse(r.startedAt)) / 1000).toFixed(1)} s` : 'running';
  }

  protected run(range = false): void {
    this.busy.set(true);
    this.actionError.set(null);
    // Dates are taken as UTC midnights; the watch adds each detector's look-back before "from" by itself.
    const body = {
      ...(range ? { from: `${this.from()}T00:00:00Z`, to: `${this.to()}T23:59:59Z` } : {}),
      ...(this.chosen().length ? { siteIds: this.chosen() } : {}),
    };
    this.api.runNow(body).subscribe({
      next: () => (this.busy.set(false), this.runs.reload()),
      error: (err: unknown) => (
        this.actionError.set(describeApiError(err, 'The run could not be started.').message),
        this.busy.set(false)
      ),
    });
  }
}
