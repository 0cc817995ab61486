import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  DEFAULT_IRRIGATION_EFFICIENCY,
  IRRIGATION_METHODS,
  PLANT_FACTOR_RANGES,
  PLANT_WATER_USE_CATEGORIES,
  type IrrigationMethod,
  type PlantWaterUseCategory,
} from '@shared/budgets/hydrozone';
import {
  HYDROZONE_LIMITS,
  SPECIAL_LANDSCAPE_KIND_LABELS,
  SPECIAL_LANDSCAPE_KINDS,
  type HydrozoneAreaUnit,
  type HydrozoneDto,
  type HydrozoneInput,
  type SpecialLandscapeKind,
} from '@shared/hydrozones/hydrozone-dto';
import { convertArea } from '@shared/units/area-depth-units';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { HydrozonesApi } from '../hydrozones-api';
import { IRRIGATION_METHOD_LABELS, PLANT_WATER_USE_LABELS } from '../hydrozone-labels';
import { efficiency, hydrozoneRules, plantFactorRange, positive } from './hydrozone-validators';

export interface HydrozoneFormData {
  siteId: number;
  zone: HydrozoneDto | null;
  /** The unit the area is first shown in (the organisation's setting). */
  areaUnit: HydrozoneAreaUnit;
}

const num = (v: number | string | null) => (v === null || v === '' ? null : Number(v));

/** Adds or edits one hydrozone in a dialog; closes with the saved zone. */
@Component({
  selector: 'rm-hydrozone-form',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatIconModule,
  ],
  templateUrl: './hydrozone-form.html',
  styleUrl: './hydrozone-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HydrozoneForm {
  private readonly api = inject(HydrozonesApi);
  private readonly ref = inject<MatDialogRef<HydrozoneForm, HydrozoneDto>>(MatDialogRef);
  protected readonly data = inject<HydrozoneFormData>(MAT_DIALOG_DATA);

  protected readonly limits = HYDROZONE_LIMITS;
  protected readonly categories = PLANT_WATER_USE_CATEGORIES;
  protected readonly categoryLabels = PLANT_WATER_USE_LABELS;
  protected readonly methods = IRRIGATION_METHODS;
  protected readonly methodLabels = IRRIGATION_METHOD_LABELS;
  protected readonly defaultEfficiency = DEFAULT_IRRIGATION_EFFICIENCY;
  protected readonly slaKinds = SPECIAL_LANDSCAPE_KINDS;
  protected readonly slaLabels = SPECIAL_LANDSCAPE_KIND_LABELS;
  protected readonly ranges = PLANT_FACTOR_RANGES;
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);

  protected readonly form = inject(NonNullableFormBuilder).group(
    {
      name: [this.data.zone?.name ?? '', [Validators.required, Validators.maxLength(HYDROZONE_LIMITS.nameMax)]],
      area: [this.initialArea() as number | null, [Validators.required, positive]],
      areaUnit: [this.data.areaUnit as HydrozoneAreaUnit],
      plantWaterUse: [(this.data.zone?.plantWaterUse ?? '') as PlantWaterUseCategory | ''],
      plantFactor: [(this.data.zone?.plantFactor ?? null) as number | null, plantFactorRange],
      irrigationMethod: [(this.data.zone?.irrigationMethod ?? '') as IrrigationMethod | '', Validators.required],
      efficiencyOverride: [(this.data.zone?.efficiencyOverride ?? null) as number | null, efficiency],
      specialLandscapeArea: [this.data.zone?.specialLandscapeArea ?? false],
      specialLandscapeKind: [(this.data.zone?.specialLandscapeKind ?? '') as SpecialLandscapeKind | ''],
      designFlowGpm: [(this.data.zone?.designFlowGpm ?? null) as number | null, positive],
      emitterCount: [(this.data.zone?.emitterCount ?? null) as number | null, [positive, Validators.pattern(/^\d+$/)]],
      emitterGph: [(this.data.zone?.emitterGph ?? null) as number | null, positive],
      soilIntakeInPerHour: [(this.data.zone?.soilIntakeInPerHour ?? null) as number | null, positive],
      notes: [this.data.zone?.notes ?? '', Validators.maxLength(HYDROZONE_LIMITS.notesMax)],
    },
    { validators: hydrozoneRules },
  );

  private initialArea(): number | null {
    const zone = this.data.zone;
    if (!zone) return null;
    const value = convertArea(zone.areaFt2, 'ft2', this.data.areaUnit);
    return Math.round(value * 100) / 100;
  }

  /** Switching the unit converts the number shown, so the area itself does not change. */
  protected switchAreaUnit(unit: HydrozoneAreaUnit): void {
    const { area, areaUnit } = this.form.controls;
    if (unit === areaUnit.value) return;
    if (area.value !== null && Number(area.value) > 0)
      area.setValue(Math.round(convertArea(Number(area.value), areaUnit.value, unit) * 100) / 100);
    areaUnit.setValue(unit);
  }

  protected async save(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const input: HydrozoneInput = {
      name: v.name.trim(),
      area: Number(v.area),
      areaUnit: v.areaUnit,
      plantWaterUse: v.plantWaterUse || null,
      plantFactor: num(v.plantFactor),
      irrigationMethod: v.irrigationMethod as IrrigationMethod,
      efficiencyOverride: num(v.efficiencyOverride),
      specialLandscapeArea: v.specialLandscapeArea,
      specialLandscapeKind: v.specialLandscapeArea ? v.specialLandscapeKind || null : null,
      designFlowGpm: num(v.designFlowGpm),
      emitterCount: num(v.emitterCount),
      emitterGph: num(v.emitterGph),
      soilIntakeInPerHour: num(v.soilIntakeInPerHour),
      notes: v.notes,
    };
    this.saving.set(true);
    this.saveError.set(null);
    try {
      const zone = this.data.zone;
      const saved = await firstValueFrom(
        zone ? this.api.update(this.data.siteId, zone.id, input) : this.api.create(this.data.siteId, input),
      );
      this.ref.close(saved);
    } catch (err) {
      const problem = describeApiError(err, 'The hydrozone could not be saved.');
      const unmatched = applyFieldErrors(this.form, problem.fields);
      this.saveError.set([problem.message, ...unmatched].join(' '));
    } finally {
      this.saving.set(false);
    }
  }
}

/** Opens the editor; resolves with the saved zone, or undefined when cancelled. */
export async function editHydrozone(dialog: MatDialog, data: HydrozoneFormData): Promise<HydrozoneDto | undefined> {
  const ref = dialog.open<HydrozoneForm, HydrozoneFormData, HydrozoneDto>(HydrozoneForm, {
    data,
    width: '720px',
    maxWidth: '96vw',
    autoFocus: 'first-tabbable',
  });
  return firstValueFrom(ref.afterClosed());
}
