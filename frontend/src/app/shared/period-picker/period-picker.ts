import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { addMonths, resolvePeriod } from '@shared/portfolio/period';
import type { PortfolioPeriod } from '@shared/portfolio/portfolio-dto';

export interface PeriodValue {
  kind: PortfolioPeriod;
  /** First day (YYYY-MM-DD); for a month or water year, any day inside it. */
  from: string;
  /** Last day; used by custom ranges. */
  to: string;
}

/** Chooses a calendar month, a water year (October to September) or a custom range of days. */
@Component({
  selector: 'rm-period-picker',
  imports: [MatButtonToggleModule, MatButtonModule, MatIconModule],
  template: `
    <div class="picker" role="group" aria-label="Period">
      <mat-button-toggle-group
        [value]="value().kind"
        (change)="chooseKind($event.value)"
        aria-label="Kind of period"
        hideSingleSelectionIndicator
      >
        <mat-button-toggle value="month">Month</mat-button-toggle>
        <mat-button-toggle value="water-year">Water year</mat-button-toggle>
        <mat-button-toggle value="custom">Custom</mat-button-toggle>
      </mat-button-toggle-group>
      @if (value().kind === 'custom') {
        <label class="day"
          >From
          <input
            type="date"
            [value]="value().from"
            [max]="value().to"
            (change)="chooseRange($any($event.target).value, value().to)"
        /></label>
        <label class="day"
          >To
          <input
            type="date"
            [value]="value().to"
            [min]="value().from"
            (change)="chooseRange(value().from, $any($event.target).value)"
        /></label>
      } @else {
        <div class="step">
          <button mat-icon-button type="button" (click)="step(-1)" [attr.aria-label]="'Previous ' + unit()">
            <mat-icon>chevron_left</mat-icon>
          </button>
          <span class="label" aria-live="polite">{{ label() }}</span>
          <button mat-icon-button type="button" (click)="step(1)" [attr.aria-label]="'Next ' + unit()">
            <mat-icon>chevron_right</mat-icon>
          </button>
        </div>
      }
    </div>
  `,
  styles: `
    .picker {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
    }
    .step {
      display: flex;
      align-items: center;
      gap: 4px;
    }
    .label {
      min-width: 10ch;
      text-align: center;
      font: var(--mat-sys-title-small);
    }
    .day {
      display: inline-flex;
      flex-direction: column;
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .day input {
      font: var(--mat-sys-body-large);
      padding: 6px 8px;
      border: 1px solid var(--mat-sys-outline);
      border-radius: 8px;
      background: var(--mat-sys-surface);
      color: var(--mat-sys-on-surface);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeriodPicker {
  readonly value = input.required<PeriodValue>();
  readonly changed = output<PeriodValue>();

  protected readonly label = computed(
    () => resolvePeriod(this.value().kind, this.value().from, this.value().from, this.value().to).label,
  );
  protected readonly unit = computed(() => (this.value().kind === 'water-year' ? 'water year' : 'month'));

  protected chooseKind(kind: PortfolioPeriod): void {
    const p = resolvePeriod(kind, this.value().from, this.value().from, this.value().to);
    this.changed.emit({ kind, from: p.from, to: p.to });
  }

  protected step(direction: 1 | -1): void {
    const { kind, from } = this.value();
    const month = addMonths(from.slice(0, 7), kind === 'water-year' ? 12 * direction : direction);
    const p = resolvePeriod(kind, `${month}-01`, `${month}-01`);
    this.changed.emit({ kind, from: p.from, to: p.to });
  }

  protected chooseRange(from: string, to: string): void {
    // A half-typed date is empty; ignore it until both ends are valid and in order.
    if (!from || !to || to < from) return;
    this.changed.emit({ kind: 'custom', from, to });
  }
}

/** The month before today's: the default for a monthly review. */
export function lastCompleteMonth(today = new Date().toISOString().slice(0, 10)): PeriodValue {
  const { kind, from, to } = resolvePeriod('month', `${addMonths(today.slice(0, 7), -1)}-01`);
  return { kind, from, to };
}
