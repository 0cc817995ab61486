import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { ControllerDto } from '@shared/meters/meter';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { MetersApi } from '../meters-api';

/** Adds a controller (zones are added to it afterwards); closes with the saved controller. */
@Component({
  selector: 'rm-controller-form',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  template: `
    <h2 mat-dialog-title>New controller</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="rm-form-grid">
        @if (saveError(); as message) {
          <div class="rm-form-error wide" role="alert">
            <mat-icon aria-hidden="true">error</mat-icon><span>{{ message }}</span>
          </div>
        }
        <mat-form-field appearance="outline">
          <mat-label>Controller ref</mat-label>
          <input matInput formControlName="ref" required maxlength="64" autocomplete="off" />
          <mat-hint>As it appears in runtime logs</mat-hint>
          @if (form.controls.ref.hasError('server')) {
            <mat-error>{{ form.controls.ref.getError('server') }}</mat-error>
          } @else {
            <mat-error>Enter the controller's ref.</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" required maxlength="120" autocomplete="off" />
          <mat-error>Give the controller a name.</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving()">Add controller</button>
      </mat-dialog-actions>
    </form>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ControllerForm {
  private readonly api = inject(MetersApi);
  private readonly ref = inject<MatDialogRef<ControllerForm, ControllerDto>>(MatDialogRef);
  private readonly siteId = inject<{ siteId: number }>(MAT_DIALOG_DATA).siteId;
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    ref: ['', [Validators.required, Validators.maxLength(64)]],
    name: ['', [Validators.required, Validators.maxLength(120)]],
  });

  protected async save(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.saving.set(true);
    this.saveError.set(null);
    try {
      this.ref.close(
        await firstValueFrom(this.api.createController(this.siteId, { ref: v.ref.trim(), name: v.name.trim() })),
      );
    } catch (err) {
      const problem = describeApiError(err, 'The controller could not be saved.');
      this.saveError.set([problem.message, ...applyFieldErrors(this.form, problem.fields)].join(' '));
    } finally {
      this.saving.set(false);
    }
  }
}

export async function addController(dialog: MatDialog, siteId: number): Promise<ControllerDto | undefined> {
  const ref = dialog.open<ControllerForm, { siteId: number }, ControllerDto>(ControllerForm, {
    data: { siteId },
    width: '560px',
    maxWidth: '96vw',
    autoFocus: 'first-tabbable',
  });
  return firstValueFrom(ref.afterClosed());
}
