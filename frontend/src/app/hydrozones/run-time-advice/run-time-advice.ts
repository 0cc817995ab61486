import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { RunTimeAdviceDto } from '@shared/budgets/budget-dto';

/** Minutes per week for one hydrozone, the steps behind them, and the safety cautions (display only). */
@Component({
  selector: 'rm-run-time-advice',
  imports: [DecimalPipe, MatIconModule],
  templateUrl: './run-time-advice.html',
  styleUrl: './run-time-advice.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunTimeAdvice {
  readonly advice = input.required<RunTimeAdviceDto>();
}
