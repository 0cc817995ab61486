import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { addMonths } from '@shared/portfolio/period';

/** Asks when the work was finished; the savings project's months follow from that date. */
@Component({
  selector: 'rm-carry-out-dialog',
  imports: [FormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Mark "{{ data.title }}" as carried out</h2>
    <mat-dialog-content>
      <mat-form-field>
        <mat-label>Work finished on</mat-label>
        <input matInput type="date" name="installedOn" [(ngModel)]="installedOn" required />
      </mat-form-field>
      @if (installedOn) {
        <p>
          A savings project is created with baseline {{ month(-12) }} to {{ month(-1) }} and reporting {{ month(1) }} to
          {{ month(12) }}; the month of the work is left out. The plan can no longer be changed.
        </p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="null">Cancel</button>
      <button mat-flat-button type="button" [disabled]="!installedOn" [mat-dialog-close]="installedOn">
        Create savings project
      </button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CarryOutDialog {
  protected readonly data = inject<{ title: string; today: string }>(MAT_DIALOG_DATA);
  protected installedOn = this.data.today;

  protected month(offset: number): string {
    return addMonths(this.installedOn.slice(0, 7), offset);
  }
}
