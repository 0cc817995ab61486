import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';

export interface NoticeDialogData {
  siteName: string;
  month: string;
  percentOfBudget: number | null;
}

/** Confirms a budget notice and takes an optional note; one notice per site and month, so it says so. */
@Component({
  selector: 'rm-notice-dialog',
  imports: [FormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Send a budget notice?</h2>
    <mat-dialog-content>
      <p>
        The managers of <strong>{{ data.siteName }}</strong> get an e-mail about {{ data.month }}
        @if (data.percentOfBudget !== null) {
          ({{ data.percentOfBudget.toFixed(0) }} % of budget)
        }
        . Only one notice can be sent per site and month.
      </p>
      <mat-form-field appearance="outline" class="full">
        <mat-label>Note to add (optional)</mat-label>
        <textarea
          matInput
          rows="4"
          maxlength="2000"
          [ngModel]="message()"
          (ngModelChange)="message.set($event)"
        ></textarea>
      </mat-form-field>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="null">Cancel</button>
      <button mat-flat-button type="button" [mat-dialog-close]="message()">Send notice</button>
    </mat-dialog-actions>
  `,
  styles: `
    .full {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NoticeDialog {
  protected readonly data = inject<NoticeDialogData>(MAT_DIALOG_DATA);
  protected readonly message = signal('');
}

/** The note (possibly empty) when confirmed, null when cancelled. */
export async function askNotice(dialog: MatDialog, data: NoticeDialogData): Promise<string | null> {
  const ref = dialog.open<NoticeDialog, NoticeDialogData, string | null>(NoticeDialog, {
    data,
    width: '480px',
    maxWidth: '92vw',
  });
  return (await firstValueFrom(ref.afterClosed())) ?? null;
}
