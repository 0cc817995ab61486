import { ChangeDetectionStrategy, Component, effect, inject, input, output } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { MonthlyNormalDto } from '@shared/weather/weather-station-dto';

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
// Monthly screening bounds the server also applies: ETo ≤ 620 mm (20 mm/d × 31), rain ≤ 3,000 mm.
const ETO_MAX_MM = 620;
const RAIN_MAX_MM = 3000;

/** Twelve monthly totals of ETo and rain, edited in the organisation's depth unit; emits them in mm. */
@Component({
  selector: 'rm-normals-editor',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule],
  template: `
    <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
      <table aria-label="Monthly normals">
        <thead>
          <tr>
            <th scope="col">Month</th>
            <th scope="col">ETo ({{ unit() }})</th>
            <th scope="col">Rain ({{ unit() }})</th>
          </tr>
        </thead>
        <tbody formArrayName="months">
          @for (row of form.controls.months.controls; track $index) {
            <tr [formGroupName]="$index">
              <th scope="row">{{ monthNames[$index] }}</th>
              <td>
                <mat-form-field appearance="outline" subscriptSizing="dynamic">
                  <input
                    matInput
                    type="number"
                    formControlName="eto"
                    step="any"
                    [attr.aria-label]="'ETo ' + monthNames[$index]"
                    [readonly]="!canEdit()"
                  />
                  @if (row.controls.eto.invalid) {
                    <mat-error>0–{{ limit(etoMax) }}</mat-error>
                  }
                </mat-form-field>
              </td>
              <td>
                <mat-form-field appearance="outline" subscriptSizing="dynamic">
                  <input
                    matInput
                    type="number"
                    formControlName="rain"
                    step="any"
                    [attr.aria-label]="'Rain ' + monthNames[$index]"
                    [readonly]="!canEdit()"
                  />
                  @if (row.controls.rain.invalid) {
                    <mat-error>0–{{ limit(rainMax) }}</mat-error>
                  }
                </mat-form-field>
              </td>
            </tr>
          }
        </tbody>
      </table>
      @if (canEdit()) {
        <button mat-flat-button type="submit">Save normals</button>
      }
    </form>
  `,
  styles: `
    table {
      border-collapse: collapse;
      margin-bottom: 12px;
    }
    th,
    td {
      padding: 2px 8px;
      text-align: left;
    }
    mat-form-field {
      width: 120px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NormalsEditor {
  readonly normals = input.required<MonthlyNormalDto[]>();
  readonly metric = input(false);
  readonly canEdit = input(false);
  readonly save = output<MonthlyNormalDto[]>();

  protected readonly monthNames = MONTHS;
  protected readonly etoMax = ETO_MAX_MM;
  protected readonly rainMax = RAIN_MAX_MM;
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    months: this.fb.array(
      MONTHS.map(() =>
        this.fb.group({
          eto: [null as number | null, [Validators.required, Validators.min(0)]],
          rain: [null as number | null, [Validators.required, Validators.min(0)]],
        }),
      ),
    ),
  });

  constructor() {
    effect(() => {
      const byMonth = new Map(this.normals().map((n) => [n.month, n]));
      const f = this.factor();
      this.form.controls.months.controls.forEach((group, i) => {
        const n = byMonth.get(i + 1);
        group.controls.eto.setValidators([Validators.required, Validators.min(0), Validators.max(ETO_MAX_MM / f)]);
        group.controls.rain.setValidators([Validators.required, Validators.min(0), Validators.max(RAIN_MAX_MM / f)]);
        group.reset({ eto: n ? round(n.etoMm / f) : null, rain: n ? round(n.rainMm / f) : null });
      });
    });
  }

  protected unit(): string {
    return this.metric() ? 'mm' : 'in';
  }

  protected limit(mm: number): string {
    return `${round(mm / this.factor())} ${this.unit()}`;
  }

  private factor(): number {
    return this.metric() ? 1 : 25.4;
  }

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const f = this.factor();
    this.save.emit(
      this.form
        .getRawValue()
        .months.map((m, i) => ({ month: i + 1, etoMm: Number(m.eto) * f, rainMm: Number(m.rain) * f })),
    );
  }
}

function round(value: number): number {
  return Math.round(value * 100) / 100;
}
