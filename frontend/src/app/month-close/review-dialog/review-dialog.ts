import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';

export interface ReviewDialogData {
  siteName: string;
  monthLabel: string;
  note: string;
}

/** Marks a site's month reviewed with what the manager noted (what was done, what to watch). */
@Component({
  selector: 'rm-review-dialog',
  imports: [FormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Review {{ data.siteName }}</h2>
    <mat-dialog-content>
      <p>
        Mark {{ data.monthLabel }} as reviewed. The note goes into the board packet under "What was done" and the site's
        history.
      </p>
      <mat-form-field appearance="outline" class="full">
        <mat-label>Note (what was done, what to watch)</mat-label>
        <textarea matInput rows="4" maxlength="2000" [ngModel]="note()" (ngModelChange)="note.set($event)"></textarea>
      </mat-form-field>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="null">Cancel</button>
      <button mat-flat-button type="button" [mat-dialog-close]="note()">Mark reviewed</button>
    </mat-dialog-actions>
  `,
  styles: `
    .full {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewDialog {
  protected readonly data = inject<ReviewDialogData>(MAT_DIALOG_DATA);
  protected readonly note = signal(this.data.note);
}

/** The note (possibly empty) when confirmed, null when cancelled. */
export async function askReview(dialog: MatDialog, data: ReviewDialogData): Promise<string | null> {
  const ref = dialog.open<ReviewDialog, ReviewDialogData, string | null>(ReviewDialog, {
    data,
    width: '480px',
    maxWidth: '94vw',
  });
  return (await firstValueFrom(ref.afterClosed())) ?? null;
}
