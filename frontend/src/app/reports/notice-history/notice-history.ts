import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ReportsApi } from '../reports-api';

export interface NoticeHistoryData {
  siteId: number;
  siteName: string;
}

/** Every budget notice sent about one site: which month, when, by whom and from which organisation, and the note. */
@Component({
  selector: 'rm-notice-history',
  imports: [MatDialogModule, MatButtonModule, MatProgressBarModule],
  template: `
    <h2 mat-dialog-title>Notices about {{ data.siteName }}</h2>
    <mat-dialog-content>
      @if (history.isLoading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the notices" />
      } @else if (history.error()) {
        <p role="alert">The notices could not be loaded.</p>
      } @else if (history.hasValue()) {
        @for (n of history.value().items; track n.sentAt) {
          <article class="notice">
            <h3>{{ monthName(n.month) }}</h3>
            <p class="sub">
              Sent {{ day(n.sentAt) }} by {{ n.sentBy }} ({{ n.senderOrganisation }}) to {{ n.recipients }}
              {{ n.recipients === 1 ? 'manager' : 'managers' }}
              @if (n.percentOfBudget !== null) {
                · {{ n.percentOfBudget.toFixed(0) }} % of budget at the time
              }
            </p>
            @if (n.message) {
              <p>{{ n.message }}</p>
            }
          </article>
        } @empty {
          <p>No notice has been sent about this site.</p>
        }
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Close</button>
    </mat-dialog-actions>
  `,
  styles: `
    .notice {
      padding: 8px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    h3 {
      margin: 0;
      font: var(--mat-sys-title-small);
    }
    .sub {
      margin: 2px 0;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NoticeHistory {
  private readonly api = inject(ReportsApi);
  protected readonly data = inject<NoticeHistoryData>(MAT_DIALOG_DATA);
  protected readonly history = rxResource({ stream: () => this.api.noticeHistory(this.data.siteId) });

  protected monthName(month: string): string {
    return new Intl.DateTimeFormat('en-US', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
      new Date(`${month}-01T00:00:00Z`),
    );
  }

  protected day(iso: string): string {
    return new Intl.DateTimeFormat('en-US', { dateStyle: 'medium' }).format(new Date(iso));
  }
}

export function showNoticeHistory(dialog: MatDialog, data: NoticeHistoryData): void {
  dialog.open(NoticeHistory, { data, width: '520px', maxWidth: '94vw' });
}
