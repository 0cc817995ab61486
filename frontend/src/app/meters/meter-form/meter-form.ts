import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  METER_PURPOSES,
  WATER_SOURCES,
  type MeterDto,
  type MeterInput,
  type MeterPurpose,
  type WaterSource,
} from '@shared/meters/meter';
import { VOLUME_UNIT_LABELS, VOLUME_UNITS, type VolumeUnit } from '@shared/units/volume-units';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { siteDate, siteMidnight } from '../../sites/site-date';
import { METER_PURPOSE_LABELS, WATER_SOURCE_LABELS } from '../meter-labels';
import { MetersApi } from '../meters-api';

export interface MeterFormData {
  siteId: number;
  timeZone: string;
  meter: MeterDto | null;
}

/** Adds or edits one meter in a dialog; dates are days on the site's calendar. Closes with the saved meter. */
@Component({
  selector: 'rm-meter-form',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
  ],
  templateUrl: './meter-form.html',
  styles: `
    .swap {
      padding: 0 24px 8px;
    }
    .hint {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MeterForm {
  private readonly api = inject(MetersApi);
  private readonly ref = inject<MatDialogRef<MeterForm, MeterDto>>(MatDialogRef);
  protected readonly data = inject<MeterFormData>(MAT_DIALOG_DATA);

  protected readonly units = VOLUME_UNITS;
  protected readonly unitLabels = VOLUME_UNIT_LABELS;
  protected readonly purposes = METER_PURPOSES;
  protected readonly purposeLabels = METER_PURPOSE_LABELS;
  protected readonly sources = WATER_SOURCES;
  protected readonly sourceLabels = WATER_SOURCE_LABELS;
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);

  private readonly meter = this.data.meter;
  protected readonly form = inject(NonNullableFormBuilder).group({
    ref: [this.meter?.ref ?? '', [Validators.required, Validators.maxLength(64)]],
    unit: [(this.meter?.unit ?? 'gal') as VolumeUnit, Validators.required],
    registerMultiplier: [this.meter?.registerMultiplier ?? 1, [Validators.required, Validators.min(0.000001)]],
    registerDigits: [
      (this.meter?.registerDigits ?? null) as number | null,
      [Validators.min(1), Validators.max(12), Validators.pattern(/^\d+$/)],
    ],
    purpose: [(this.meter?.purpose ?? 'dedicated-irrigation') as MeterPurpose, Validators.required],
    waterSource: [(this.meter?.waterSource ?? 'potable') as WaterSource, Validators.required],
    installedAt: [this.localDate(this.meter?.installedAt ?? null)],
    removedAt: [this.localDate(this.meter?.removedAt ?? null)],
  });

  /** Editing only: a replaced register, from the day it was swapped (the site's midnight) with its own settings. */
  protected readonly swap = inject(NonNullableFormBuilder).group({
    swappedOn: ['', Validators.required],
    multiplier: [1, [Validators.required, Validators.min(0.000001)]],
    digits: [null as number | null, [Validators.min(1), Validators.max(12), Validators.pattern(/^\d+$/)]],
  });
  protected readonly previous = this.meter?.previousRegisters ?? [];

  protected async recordSwap(): Promise<void> {
    if (!this.meter || this.swap.invalid) {
      this.swap.markAllAsTouched();
      return;
    }
    const v = this.swap.getRawValue();
    const swap = {
      swappedAt: siteMidnight(v.swappedOn, this.data.timeZone),
      multiplier: Number(v.multiplier),
      digits: v.digits === null || String(v.digits) === '' ? null : Number(v.digits),
    };
    this.saving.set(true);
    this.saveError.set(null);
    try {
      this.ref.close(await firstValueFrom(this.api.recordSwap(this.data.siteId, this.meter.id, swap)));
    } catch (err) {
      const problem = describeApiError(err, 'The swap could not be recorded.');
      this.saveError.set([problem.message, ...Object.values(problem.fields)].join(' '));
    } finally {
      this.saving.set(false);
    }
  }

  protected localDay(iso: string | null): string {
    return iso ? this.localDate(iso) : '…';
  }

  protected async save(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    if (v.installedAt && v.removedAt && v.removedAt <= v.installedAt) {
      this.form.controls.removedAt.setErrors({ order: true });
      this.form.controls.removedAt.markAsTouched();
      return;
    }
    const input: Omit<MeterInput, 'previousRegisters'> = {
      ref: v.ref.trim(),
      unit: v.unit,
      registerMultiplier: Number(v.registerMultiplier),
      registerDigits: v.registerDigits === null || String(v.registerDigits) === '' ? null : Number(v.registerDigits),
      purpose: v.purpose,
      waterSource: v.waterSource,
      installedAt: v.installedAt ? siteMidnight(v.installedAt, this.data.timeZone) : null,
      removedAt: v.removedAt ? siteMidnight(v.removedAt, this.data.timeZone) : null,
    };
    this.saving.set(true);
    this.saveError.set(null);
    try {
      const saved = await firstValueFrom(
        this.meter
          ? this.api.updateMeter(this.data.siteId, this.meter.id, input)
          : this.api.createMeter(this.data.siteId, { ...input, previousRegisters: [] }),
      );
      this.ref.close(saved);
    } catch (err) {
      const problem = describeApiError(err, 'The meter could not be saved.');
      const unmatched = applyFieldErrors(this.form, problem.fields);
      this.saveError.set([problem.message, ...unmatched].join(' '));
    } finally {
      this.saving.set(false);
    }
  }

  private localDate(iso: string | null): string {
    return iso ? siteDate(this.data.timeZone, new Date(iso)) : '';
  }
}

/** Opens the editor; resolves with the saved meter, or undefined when cancelled. */
export async function editMeter(dialog: MatDialog, data: MeterFormData): Promise<MeterDto | undefined> {
  const ref = dialog.open<MeterForm, MeterFormData, MeterDto>(MeterForm, {
    data,
    width: '640px',
    maxWidth: '96vw',
    autoFocus: 'first-tabbable',
  });
  return firstValueFrom(ref.afterClosed());
}
