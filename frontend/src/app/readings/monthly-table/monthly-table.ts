import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import type { MonthlyTotals } from '@shared/readings/monthly-totals';
import type { MonthlyFlag, MonthlyRow } from '@shared/readings/readings-dto';
import { formatVolume } from '@shared/units/format-quantity';

const FLAG_LABELS: Record<MonthlyFlag, string> = {
  'over-budget': 'Over budget',
  'partial-data': 'Partial data',
  'no-data': 'No data',
  'no-budget': 'No budget',
  'weather-filled': 'Weather from normals',
  'partial-budget': 'Budget covers part of the month',
  estimated: 'Includes estimated reads',
  'from-bills': 'Spread from bills',
};

/** The site's months: use, budget, variance, percent, ETo, rain, cost and flags. Display only. */
@Component({
  selector: 'rm-monthly-table',
  imports: [MatTableModule],
  template: `
    <div class="rm-table-scroll">
      <table mat-table [dataSource]="rows()" aria-label="Monthly use against budget">
        <ng-container matColumnDef="month">
          <th mat-header-cell *matHeaderCellDef>Month</th>
          <td mat-cell *matCellDef="let r">{{ r.month }}</td>
          <td mat-footer-cell *matFooterCellDef>{{ totalsLabel() }}</td>
        </ng-container>
        <ng-container matColumnDef="use">
          <th mat-header-cell *matHeaderCellDef class="num">Use (gal)</th>
          <td mat-cell *matCellDef="let r" class="num" data-col="use">{{ gal(r.useGallons) }}</td>
          <td mat-footer-cell *matFooterCellDef class="num">
            {{ t()?.useGallons === undefined ? '' : gal(t()!.useGallons) }}
          </td>
        </ng-container>
        <ng-container matColumnDef="budget">
          <th mat-header-cell *matHeaderCellDef class="num">Budget (gal)</th>
          <td mat-cell *matCellDef="let r" class="num">{{ gal(r.budgetGallons) }}</td>
          <td mat-footer-cell *matFooterCellDef class="num">{{ t() ? gal(t()!.budgetGallons) : '' }}</td>
        </ng-container>
        <ng-container matColumnDef="variance">
          <th mat-header-cell *matHeaderCellDef class="num">Variance (gal)</th>
          <td mat-cell *matCellDef="let r" class="num" [class.over]="(r.varianceGallons ?? 0) > 0">
            {{ signed(r.varianceGallons) }}
          </td>
          <td mat-footer-cell *matFooterCellDef class="num" [class.over]="(t()?.varianceGallons ?? 0) > 0">
            {{ t() ? signed(t()!.varianceGallons) : '' }}
          </td>
        </ng-container>
        <ng-container matColumnDef="percent">
          <th mat-header-cell *matHeaderCellDef class="num">Of budget (%)</th>
          <td mat-cell *matCellDef="let r" class="num">
            {{ r.percentOfBudget === null ? '—' : num(r.percentOfBudget, 0) }}
          </td>
          <td mat-footer-cell *matFooterCellDef class="num">
            {{ (t()?.percentOfBudget ?? null) === null ? '—' : num(t()!.percentOfBudget, 0) }}
          </td>
        </ng-container>
        <ng-container matColumnDef="eto">
          <th mat-header-cell *matHeaderCellDef class="num">ETo (mm)</th>
          <td mat-cell *matCellDef="let r" class="num">{{ num(r.etoMm, 1) }}</td>
          <td mat-footer-cell *matFooterCellDef class="num">{{ t() ? num(t()!.etoMm, 1) : '' }}</td>
        </ng-container>
        <ng-container matColumnDef="rain">
          <th mat-header-cell *matHeaderCellDef class="num">Rain (mm)</th>
          <td mat-cell *matCellDef="let r" class="num">{{ num(r.rainMm, 1) }}</td>
          <td mat-footer-cell *matFooterCellDef class="num">{{ t() ? num(t()!.rainMm, 1) : '' }}</td>
        </ng-container>
        <ng-container matColumnDef="cost">
          <th mat-header-cell *matHeaderCellDef class="num">Cost</th>
          <td mat-cell *matCellDef="let r" class="num">{{ money(r.cost, r.currency) }}</td>
          <td mat-footer-cell *matFooterCellDef class="num">{{ t() ? money(t()!.cost, t()!.currency) : '' }}</td>
        </ng-container>
        <ng-container matColumnDef="flags">
          <th mat-header-cell *matHeaderCellDef>Flags</th>
          <td mat-cell *matCellDef="let r">
            @for (f of r.flags; track f) {
              <span class="flag" [class]="'flag flag-' + f">{{ flagLabels[f] }}</span>
            }
          </td>
          <td mat-footer-cell *matFooterCellDef class="note">{{ totalsNote() }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let r; columns: columns" [attr.data-month]="r.month"></tr>
        <tr mat-footer-row *matFooterRowDef="columns" class="totals" data-month="total" [hidden]="!t()"></tr>
        <tr *matNoDataRow>
          <td [attr.colspan]="columns.length">
            <div class="rm-state"><p>No months in this range.</p></div>
          </td>
        </tr>
      </table>
    </div>
  `,
  styles: `
    table {
      width: 100%;
    }
    td,
    th {
      white-space: nowrap;
    }
    .num {
      text-align: right;
      font-variant-numeric: tabular-nums;
    }
    .over {
      color: var(--rm-soil, #a4562a);
      font-weight: 600;
    }
    .flag {
      display: inline-block;
      margin: 2px 4px 2px 0;
      padding: 0 8px;
      border-radius: 10px;
      font: var(--mat-sys-label-small);
      background: var(--mat-sys-surface-container-high);
    }
    .totals td {
      font-weight: 600;
      border-top: 2px solid var(--mat-sys-outline);
    }
    .totals .note {
      font-weight: 400;
      white-space: normal;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .flag-over-budget {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MonthlyTable {
  readonly months = input.required<MonthlyRow[]>();
  /** The totals row over the months shown (from the server, so the CSV and the page agree). */
  readonly totals = input<MonthlyTotals | null>(null);
  protected readonly t = this.totals;
  protected readonly totalsLabel = computed(() => `Total, ${this.totals()?.months ?? 0} months`);
  /** When some months lack readings or a budget, the budget and variance cover only the others; say so. */
  protected readonly totalsNote = computed(() => {
    const t = this.totals();
    if (!t || t.budgetedMonths === t.months) return '';
    return `Budget and variance over the ${t.budgetedMonths} months with readings and a budget`;
  });
  protected readonly rows = computed(() => [...this.months()].reverse());
  protected readonly columns = ['month', 'use', 'budget', 'variance', 'percent', 'eto', 'rain', 'cost', 'flags'];
  protected readonly flagLabels: Record<string, string> = FLAG_LABELS;

  protected gal(v: number | null): string {
    return v === null ? '—' : formatVolume(v, 'gal').replace(/ gal$/, '');
  }

  protected signed(v: number | null): string {
    return v === null ? '—' : `${v > 0 ? '+' : ''}${this.gal(v)}`;
  }

  protected num(v: number | null, digits: number): string {
    return v === null
      ? '—'
      : v.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
  }

  protected money(v: number | null, currency: string | null): string {
    if (v === null) return '—';
    return currency ? new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(v) : v.toFixed(2);
  }
}
