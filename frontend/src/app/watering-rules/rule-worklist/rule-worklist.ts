import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import type { RuleWorklistRow } from '@shared/watering-rules/rules-dto';
import { SEVERITY_LABELS } from '@shared/alerts/alert-dto';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { askNotice } from '../../reports/notice-dialog/notice-dialog';
import { ReportsApi } from '../../reports/reports-api';
import { WateringRulesApi } from '../watering-rules-api';

/** Last month on the browser's clock, YYYY-MM: the month an officer usually reviews. */
function lastMonth(): string {
  const d = new Date();
  return new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() - 1, 1)).toISOString().slice(0, 7);
}

/**
 * The conservation officer's worklist: sites under the organisation's watering rules that watered outside them in a
 * month, from the nightly watch's alerts; manual runs counted apart. A notice goes out as the budget notice does.
 */
@Component({
  selector: 'rm-rule-worklist',
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
    <header class="rm-page-header">
      <h1>Watering outside the rules</h1>
      <a mat-stroked-button routerLink="rules"><mat-icon>rule</mat-icon> Rules by stage</a>
      <a mat-stroked-button routerLink="/alerts/repairs"><mat-icon>build</mat-icon> Repair times</a>
    </header>
    <p class="caution">
      <mat-icon inline>gavel</mat-icon> Watering restrictions are set by the local water agency. Rillmark checks
      controller logs (or metered hours where a site sends no log) against the rules entered here; the agency's
      published rules decide. Manual runs are listed apart and never raise a finding by themselves.
    </p>
    <div class="controls">
      <mat-form-field>
        <mat-label>Month</mat-label>
        <input matInput type="month" [ngModel]="month()" (ngModelChange)="month.set($event)" name="month" />
      </mat-form-field>
      @if (list.hasValue()) {
        <span>{{ list.value().total }} of {{ list.value().sitesUnderRules }} site(s) under your rules</span>
      }
    </div>
    <div class="rm-progress-slot">
      @if (list.isLoading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the worklist" />
      }
    </div>
    @if (loadError(); as message) {
      <p class="rm-form-error" role="alert">{{ message }}</p>
    }
    @if (list.hasValue()) {
      @if (list.value().items.length === 0) {
        <p class="rm-state">No site under your rules watered outside them in {{ month() }}.</p>
      } @else {
        <table class="card-table" aria-label="Sites watering outside the rules">
          <thead>
            <tr>
              <th scope="col">Site</th>
              <th scope="col" class="num">Runs outside</th>
              <th scope="col" class="num">Minutes</th>
              <th scope="col">Why</th>
              <th scope="col" class="num">Manual (apart)</th>
              <th scope="col">Alert</th>
              <th scope="col">Notice</th>
            </tr>
          </thead>
          <tbody>
            @for (row of list.value().items; track row.alertId) {
              <tr>
                <th scope="row" data-label="Site">
                  {{ row.siteName }}
                  <span class="sub">{{ severityLabels[row.severity] }}</span>
                </th>
                <td class="num" data-label="Runs outside">{{ row.runsOutsideRules }}</td>
                <td class="num" data-label="Minutes">{{ row.minutesOutsideRules }} min</td>
                <td data-label="Why">{{ why(row) }}</td>
                <td class="num" data-label="Manual (apart)">{{ row.manualRunsOutsideRules }}</td>
                <td data-label="Alert">
                  <a [routerLink]="['/alerts', row.alertId]">Runs listed</a> ({{ row.status }})
                </td>
                <td data-label="Notice">
                  <button mat-stroked-button type="button" [disabled]="sending()" (click)="notice(row)">
                    Send notice
                  </button>
                </td>
              </tr>
            }
          </tbody>
        </table>
      }
    }
  `,
  styleUrl: '../../shared/card-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RuleWorklist {
  private readonly api = inject(WateringRulesApi);
  private readonly reports = inject(ReportsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);

  protected readonly month = signal(lastMonth());
  protected readonly list = rxResource({
    params: () => (/^\d{4}-\d{2}$/.test(this.month()) ? this.month() : undefined),
    stream: ({ params }) => this.api.worklist(params),
  });
  protected readonly loadError = computed(() => {
    const error = this.list.error();
    return error ? describeApiError(error, 'The worklist could not be loaded.').message : null;
  });
  protected readonly severityLabels: Record<string, string> = SEVERITY_LABELS;
  protected readonly sending = signal(false);

  protected why(row: RuleWorklistRow): string {
    const parts = [
      row.notAWateringDay ? `${row.notAWateringDay} on a day not allowed` : '',
      row.outsideAllowedHours ? `${row.outsideAllowedHours} outside the hours` : '',
      row.overStationLimit ? `${row.overStationLimit} over the station limit` : '',
      row.fromMeterOnly ? `${row.fromMeterOnly} from meter hours` : '',
    ];
    return parts.filter(Boolean).join('; ');
  }

  protected async notice(row: RuleWorklistRow): Promise<void> {
    const message = await askNotice(this.dialog, { siteName: row.siteName, month: row.month, percentOfBudget: null });
    if (message === null) return;
    const text =
      `${row.runsOutsideRules} irrigation run(s) in ${row.month} fell outside the local watering rules ` +
      `(${this.why(row)}). ${message}`.trim();
    this.sending.set(true);
    try {
      await firstValueFrom(this.reports.sendNotice(row.siteId, row.month, text));
      this.snack.open(`Notice sent to the managers of ${row.siteName}.`, 'OK', { duration: 5000 });
    } catch (err) {
      this.snack.open(describeApiError(err, 'The notice could not be sent.').message, 'OK', { duration: 8000 });
    } finally {
      this.sending.set(false);
    }
  }
}
