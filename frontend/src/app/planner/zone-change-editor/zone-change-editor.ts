import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { IRRIGATION_METHODS, PLANT_FACTOR_RANGES } from '@shared/budgets/hydrozone';
import type { HydrozoneDto } from '@shared/hydrozones/hydrozone-dto';
import type { ZoneChange } from '@shared/planner/plan-dto';
import { IRRIGATION_METHOD_LABELS } from '../../hydrozones/hydrozone-labels';

/** One hydrozone on the plan's copy: quick changes, or each figure by hand; empty fields keep today's value. */
@Component({
  selector: 'rm-zone-change-editor',
  imports: [DecimalPipe, FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    @let z = zone();
    @let c = change();
    <fieldset class="zone">
      <legend>{{ z.name }}</legend>
      <p class="today">
        Today: {{ methodLabels[z.irrigationMethod] }}, plant factor {{ z.effectivePlantFactor | number: '1.2-2' }},
        efficiency {{ z.effectiveEfficiency | number: '1.2-2' }}, {{ z.areaFt2 | number: '1.0-0' }} ft²
      </p>
      @if (editable()) {
        <div class="quick">
          @if (!z.irrigationMethod.includes('drip')) {
            <button mat-stroked-button type="button" (click)="patch({ irrigationMethod: 'drip' })">To drip</button>
          }
          <button mat-stroked-button type="button" (click)="patch({ plantFactor: lowWater })">
            Low-water plants (PF {{ lowWater }})
          </button>
          <button mat-stroked-button type="button" (click)="patch({ areaRemovedFt2: z.areaFt2 })">Remove all</button>
          @if (c) {
            <button mat-button type="button" (click)="changed.emit({ hydrozoneId: z.id, remove: true })">Undo</button>
          }
        </div>
        <div class="rm-form-grid">
          <mat-form-field>
            <mat-label>Irrigation method</mat-label>
            <mat-select [ngModel]="c?.irrigationMethod ?? null" (ngModelChange)="patch({ irrigationMethod: $event })">
              <mat-option [value]="null">Unchanged</mat-option>
              @for (m of methods; track m) {
                <mat-option [value]="m">{{ methodLabels[m] }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
          <mat-form-field>
            <mat-label>Plant factor</mat-label>
            <input
              matInput
              type="number"
              inputmode="decimal"
              min="0"
              max="1"
              step="0.05"
              [ngModel]="c?.plantFactor ?? null"
              (ngModelChange)="patch({ plantFactor: num($event) })"
            />
          </mat-form-field>
          <mat-form-field>
            <mat-label>Area removed (ft²)</mat-label>
            <input
              matInput
              type="number"
              inputmode="decimal"
              min="0"
              [max]="z.areaFt2"
              [ngModel]="c?.areaRemovedFt2 ?? null"
              (ngModelChange)="patch({ areaRemovedFt2: num($event) })"
            />
          </mat-form-field>
          <mat-form-field>
            <mat-label>Efficiency</mat-label>
            <input
              matInput
              type="number"
              inputmode="decimal"
              min="0"
              max="1"
              step="0.01"
              [ngModel]="c?.efficiency ?? null"
              (ngModelChange)="patch({ efficiency: num($event) })"
            />
            <mat-hint>Empty: the method's default</mat-hint>
          </mat-form-field>
        </div>
      } @else if (c) {
        <p>
          Plan:
          @if (c.irrigationMethod) {
            {{ methodLabels[c.irrigationMethod] }};
          }
          @if (c.plantFactor !== null && c.plantFactor !== undefined) {
            plant factor {{ c.plantFactor }};
          }
          @if (c.areaRemovedFt2) {
            {{ c.areaRemovedFt2 | number: '1.0-0' }} ft² removed;
          }
          @if (c.efficiency) {
            efficiency {{ c.efficiency }}
          }
        </p>
      }
    </fieldset>
  `,
  styles: `
    .zone {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      padding: 12px 16px;
      margin: 0 0 12px;
      min-width: 0;
    }
    legend {
      font: var(--mat-sys-title-medium);
      padding: 0 4px;
    }
    .today {
      color: var(--mat-sys-on-surface-variant);
      margin: 0 0 8px;
    }
    .quick {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      margin-bottom: 12px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ZoneChangeEditor {
  readonly zone = input.required<HydrozoneDto>();
  readonly change = input<ZoneChange | undefined>(undefined);
  readonly editable = input(false);
  /** The zone's whole change after an edit, or `remove` to drop it. */
  readonly changed = output<ZoneChange | { hydrozoneId: number; remove: true }>();

  protected readonly methods = IRRIGATION_METHODS;
  protected readonly methodLabels = IRRIGATION_METHOD_LABELS;
  /** The middle of MWELO's "low" plant-factor range. */
  protected readonly lowWater = PLANT_FACTOR_RANGES.low.default;

  protected patch(fields: Partial<ZoneChange>): void {
    this.changed.emit({ ...(this.change() ?? {}), ...fields, hydrozoneId: this.zone().id });
  }

  protected num(value: unknown): number | null {
    return value === '' || value === null || value === undefined ? null : Number(value);
  }
}
