import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { ControllerDto, ZoneDto, ZoneInput } from '@shared/meters/meter';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { positive } from '../../hydrozones/hydrozone-form/hydrozone-validators';
import { MetersApi } from '../meters-api';

export interface ZoneFormData {
  siteId: number;
  controller: ControllerDto;
  /** Null to add a zone. */
  zone: ZoneDto | null;
  hydrozones: { id: number; name: string }[];
}

const num = (v: number | string | null) => (v === null || v === '' ? null : Number(v));

/** Adds a zone (one station) to a controller or edits one; closes with the controller as saved. */
@Component({
  selector: 'rm-zone-form',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
  ],
  template: `
    <h2 mat-dialog-title>
      {{ data.zone ? 'Edit zone ' + data.zone.station : 'New zone' }} on {{ data.controller.name }}
    </h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="rm-form-grid">
        @if (saveError(); as message) {
          <div class="rm-form-error wide" role="alert">
            <mat-icon aria-hidden="true">error</mat-icon><span>{{ message }}</span>
          </div>
        }
        <mat-form-field appearance="outline">
          <mat-label>Station</mat-label>
          <input matInput formControlName="station" required maxlength="16" autocomplete="off" />
          @if (form.controls.station.hasError('server')) {
            <mat-error>{{ form.controls.station.getError('server') }}</mat-error>
          } @else {
            <mat-error>Enter the station number.</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Zone name</mat-label>
          <input matInput formControlName="name" required maxlength="120" autocomplete="off" />
          <mat-error>Give the zone a name.</mat-error>
        </mat-form-field>
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Hydrozone watered</mat-label>
          <mat-select formControlName="hydrozoneId">
            <mat-option [value]="null">Not linked</mat-option>
            @for (h of data.hydrozones; track h.id) {
              <mat-option [value]="h.id">{{ h.name }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Design flow</mat-label>
          <input matInput type="number" formControlName="designGpm" min="0" step="any" />
          <span matTextSuffix>gpm</span>
          <mat-error>Enter a flow greater than 0.</mat-error>
        </mat-form-field>
        <span></span>
        <mat-form-field appearance="outline">
          <mat-label>Emitter count</mat-label>
          <input matInput type="number" formControlName="emitterCount" min="1" step="1" />
          <mat-error>Enter a whole number greater than 0.</mat-error>
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Flow per emitter</mat-label>
          <input matInput type="number" formControlName="emitterGph" min="0" step="any" />
          <span matTextSuffix>gph</span>
          <mat-error>Enter a flow greater than 0.</mat-error>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving()">{{ data.zone ? 'Save zone' : 'Add zone' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ZoneForm {
  private readonly api = inject(MetersApi);
  private readonly ref = inject<MatDialogRef<ZoneForm, ControllerDto>>(MatDialogRef);
  protected readonly data = inject<ZoneFormData>(MAT_DIALOG_DATA);
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);
  private readonly zone = this.data.zone;
  protected readonly form = inject(NonNullableFormBuilder).group({
    station: [this.zone?.station ?? '', [Validators.required, Validators.maxLength(16)]],
    name: [this.zone?.name ?? '', [Validators.required, Validators.maxLength(120)]],
    hydrozoneId: [this.zone?.hydrozoneId ?? null],
    designGpm: [this.zone?.designGpm ?? null, positive],
    emitterCount: [this.zone?.emitterCount ?? null, [positive, Validators.pattern(/^\d+$/)]],
    emitterGph: [this.zone?.emitterGph ?? null, positive],
  });

  protected async save(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const input: ZoneInput = {
      station: v.station.trim(),
      name: v.name.trim(),
      hydrozoneId: v.hydrozoneId,
      designGpm: num(v.designGpm),
      emitterCount: num(v.emitterCount),
      emitterGph: num(v.emitterGph),
    };
    this.saving.set(true);
    this.saveError.set(null);
    try {
      const { siteId, controller } = this.data;
      const saved = this.zone
        ? this.api.updateZone(siteId, controller.id, this.zone.id, input)
        : this.api.addZone(siteId, controller.id, input);
      this.ref.close(await firstValueFrom(saved));
    } catch (err) {
      const problem = describeApiError(err, 'The zone could not be saved.');
      this.saveError.set([problem.message, ...applyFieldErrors(this.form, problem.fields)].join(' '));
    } finally {
      this.saving.set(false);
    }
  }
}

export async function editZone(dialog: MatDialog, data: ZoneFormData): Promise<ControllerDto | undefined> {
  const ref = dialog.open<ZoneForm, ZoneFormData, ControllerDto>(ZoneForm, {
    data,
    width: '640px',
    maxWidth: '96vw',
    autoFocus: 'first-tabbable',
  });
  return firstValueFrom(ref.afterClosed());
}
