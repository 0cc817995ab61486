import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { validateRateSchedule, type BillingUnit, type VolumeCharge } from '@shared/rates/rate-schedule';
import { RATE_SCHEDULE_LIMITS, type RateScheduleDto, type RateScheduleInput } from '@shared/rates/rate-schedule-dto';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { RatesApi } from '../rates-api';

export interface RateScheduleFormData {
  siteId: number;
  schedule: RateScheduleDto | null;
}

type Kind = VolumeCharge['kind'];

/** Adds or edits a site's rate schedule: fixed charge plus a uniform, tiered or budget-based volume charge. */
@Component({
  selector: 'rm-rate-schedule-form',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
  ],
  templateUrl: './rate-schedule-form.html',
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(2, minmax(0, 1fr));
      gap: 4px 16px;
    }
    .wide {
      grid-column: 1 / -1;
    }
    .tier {
      display: flex;
      gap: 12px;
      align-items: flex-start;
    }
    .problems {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RateScheduleForm {
  private readonly api = inject(RatesApi);
  private readonly ref = inject<MatDialogRef<RateScheduleForm, RateScheduleDto>>(MatDialogRef);
  protected readonly data = inject<RateScheduleFormData>(MAT_DIALOG_DATA);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly saving = signal(false);
  protected readonly problems = signal<string[]>([]);

  private readonly charge = this.data.schedule?.volumeCharge;
  protected readonly form = this.fb.group({
    name: [this.data.schedule?.name ?? '', [Validators.required, Validators.maxLength(RATE_SCHEDULE_LIMITS.nameMax)]],
    unit: [this.data.schedule?.unit ?? ('ccf' as BillingUnit)],
    currency: [
      this.data.schedule?.currency ?? 'USD',
      [Validators.required, Validators.pattern(RATE_SCHEDULE_LIMITS.currencyPattern)],
    ],
    fixedChargePerPeriod: [
      this.data.schedule?.fixedChargePerPeriod ?? (0 as number | null),
      [Validators.required, Validators.min(0)],
    ],
    effectiveFrom: [this.data.schedule?.effectiveFrom ?? new Date().toISOString().slice(0, 10), Validators.required],
    kind: [(this.charge?.kind ?? 'uniform') as Kind],
    price: [this.charge?.kind === 'uniform' ? this.charge.pricePerUnit : (null as number | null), Validators.min(0)],
    tiers: this.fb.array(
      (this.charge && this.charge.kind !== 'uniform'
        ? this.charge.tiers.map((t) => ({
            upTo: 'upToUnits' in t ? t.upToUnits : t.upToPercentOfBudget,
            price: t.pricePerUnit,
          }))
        : [{ upTo: null as number | null, price: 0 }]
      ).map((t) => this.tierGroup(t.upTo, t.price)),
    ),
  });

  private tierGroup(upTo: number | null, price: number | null) {
    return this.fb.group({ upTo: [upTo, Validators.min(0)], price: [price, [Validators.required, Validators.min(0)]] });
  }

  protected addTier(): void {
    this.form.controls.tiers.push(this.tierGroup(null, null));
  }

  protected removeTier(index: number): void {
    this.form.controls.tiers.removeAt(index);
  }

  private build(): RateScheduleInput {
    const v = this.form.getRawValue();
    const tiers = v.tiers.map((t) => ({
      upTo: t.upTo === null || (t.upTo as unknown) === '' ? null : Number(t.upTo),
      price: Number(t.price),
    }));
    const volumeCharge: VolumeCharge =
      v.kind === 'uniform'
        ? { kind: 'uniform', pricePerUnit: Number(v.price) }
        : v.kind === 'tiered'
          ? { kind: 'tiered', tiers: tiers.map((t) => ({ upToUnits: t.upTo, pricePerUnit: t.price })) }
          : { kind: 'budget-based', tiers: tiers.map((t) => ({ upToPercentOfBudget: t.upTo, pricePerUnit: t.price })) };
    return {
      name: v.name.trim(),
      unit: v.unit,
      currency: v.currency.toUpperCase(),
      fixedChargePerPeriod: Number(v.fixedChargePerPeriod),
      effectiveFrom: v.effectiveFrom,
      volumeCharge,
    };
  }

  protected async save(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const input = this.build();
    // The same rules the server applies, so tier mistakes are named before sending.
    const problems = validateRateSchedule(input);
    if (input.volumeCharge.kind === 'uniform' && this.form.controls.price.value === null)
      problems.push('Enter the price per unit');
    this.problems.set(problems);
    if (problems.length) return;
    this.saving.set(true);
    try {
      const s = this.data.schedule;
      this.ref.close(
        await firstValueFrom(
          s ? this.api.update(this.data.siteId, s.id, input) : this.api.create(this.data.siteId, input),
        ),
      );
    } catch (err) {
      const problem = describeApiError(err, 'The rate schedule could not be saved.');
      this.problems.set([problem.message, ...applyFieldErrors(this.form, problem.fields)]);
    } finally {
      this.saving.set(false);
    }
  }
}

export function editRateSchedule(dialog: MatDialog, data: RateScheduleFormData): Promise<RateScheduleDto | undefined> {
  return firstValueFrom(
    dialog
      .open<RateScheduleForm, RateScheduleFormData, RateScheduleDto>(RateScheduleForm, {
        data,
        width: '640px',
        maxWidth: '96vw',
      })
      .afterClosed(),
  );
}
