import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { BudgetMonthDto, SiteBudgetDto } from '@shared/budgets/budget-dto';
import { mmToInches } from '@shared/units/area-depth-units';
import { formatDepth, formatVolume } from '@shared/units/format-quantity';
import { fromGallons } from '@shared/units/volume-units';
import { DAILY_WEATHER_METHOD_LABELS } from '@shared/weather/weather-station-dto';

/**
 * A site's budget month by month, in the organisation's units, each month expandable into the hand
 * calculation of every hydrozone (display only: the page fetches the budget).
 */
@Component({
  selector: 'rm-budget-table',
  imports: [DecimalPipe, MatTableModule, MatButtonModule, MatIconModule, MatTooltipModule],
  templateUrl: './budget-table.html',
  styleUrl: './budget-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BudgetTable {
  readonly budget = input.required<SiteBudgetDto>();

  protected readonly columns = computed(() =>
    this.budget().indoor
      ? ['month', 'eto', 'rain', 'credit', 'budget', 'indoor', 'cost', 'expand']
      : ['month', 'eto', 'rain', 'credit', 'budget', 'cost', 'expand'],
  );
  protected readonly expanded = signal<string | null>(null);
  protected readonly methodLabels = DAILY_WEATHER_METHOD_LABELS;
  protected readonly metric = computed(() => this.budget().unitSystem === 'metric');

  protected depth(mm: number): string {
    return this.metric() ? formatDepth(mm, 'mm') : formatDepth(mmToInches(mm), 'in');
  }

  protected volume(gallons: number): string {
    return this.metric() ? formatVolume(fromGallons(gallons, 'm3'), 'm3') : formatVolume(gallons, 'gal');
  }

  protected rainCredit(month: BudgetMonthDto): number {
    return month.zones.reduce((sum, z) => sum + z.rainCreditGallons, 0);
  }

  protected money(amount: number, currency: string): string {
    return new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(amount);
  }

  protected methodText(month: BudgetMonthDto): string {
    return month.methods.map((m) => this.methodLabels[m]).join(', ');
  }

  protected toggle(month: string): void {
    this.expanded.update((open) => (open === month ? null : month));
  }

  protected monthLabel(month: string): string {
    const [y, m] = month.split('-').map(Number) as [number, number];
    return new Date(Date.UTC(y, m - 1, 1)).toLocaleDateString('en-US', {
      month: 'short',
      year: 'numeric',
      timeZone: 'UTC',
    });
  }
}
