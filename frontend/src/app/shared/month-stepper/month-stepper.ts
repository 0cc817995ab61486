import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { addMonths } from '@shared/portfolio/period';

/** Steps through calendar months: previous, the month's name, next (never past `latest`). */
@Component({
  selector: 'rm-month-stepper',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <div class="step" role="group" aria-label="Month">
      <button mat-icon-button type="button" (click)="changed.emit(previous())" aria-label="Previous month">
        <mat-icon>chevron_left</mat-icon>
      </button>
      <span class="label" aria-live="polite">{{ label() }}</span>
      <button
        mat-icon-button
        type="button"
        (click)="changed.emit(next())"
        [disabled]="latest() !== null && next() > latest()!"
        aria-label="Next month"
      >
        <mat-icon>chevron_right</mat-icon>
      </button>
    </div>
  `,
  styles: `
    .step {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
    .label {
      min-width: 9.5em;
      text-align: center;
      font: var(--mat-sys-title-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MonthStepper {
  /** YYYY-MM */
  readonly month = input.required<string>();
  readonly latest = input<string | null>(null);
  readonly changed = output<string>();

  protected readonly previous = computed(() => addMonths(this.month(), -1));
  protected readonly next = computed(() => addMonths(this.month(), 1));
  protected readonly label = computed(() =>
    new Intl.DateTimeFormat('en-US', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
      new Date(`${this.month()}-01T00:00:00Z`),
    ),
  );
}
