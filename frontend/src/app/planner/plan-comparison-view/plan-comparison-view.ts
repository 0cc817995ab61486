import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { PlanComparisonDto } from '@shared/planner/plan-dto';

/** Today and with the plan side by side: allowance, estimated use, ETAF, money, payback. */
@Component({
  selector: 'rm-plan-comparison-view',
  imports: [DecimalPipe],
  template: `
    @let c = comparison();
    <div class="headline" role="group" aria-label="What the plan saves">
      <div>
        <span class="k">Water saved per year</span>
        <span class="v">{{ c.savedGal | number: '1.0-0' }} gal</span>
        @if (c.savedPercent !== null) {
          <span class="k">{{ c.savedPercent | number: '1.0-1' }} % of today's estimate</span>
        }
      </div>
      <div>
        <span class="k">Money saved per year</span>
        <span class="v">{{ money(c.savedMoney) }}</span>
        <span class="k">{{ c.rateScheduleName ?? 'no rate schedule' }}</span>
      </div>
      <div>
        <span class="k">Simple payback</span>
        <span class="v">{{ c.paybackYears === null ? '—' : (c.paybackYears | number: '1.1-1') + ' years' }}</span>
        <span class="k">cost of work {{ money(c.costOfWork) }}</span>
      </div>
    </div>
    <table class="compare" aria-label="Today and with the plan">
      <thead>
        <tr>
          <th scope="col"><span class="rm-visually-hidden">Figure</span></th>
          <th scope="col">Today</th>
          <th scope="col">With the plan</th>
        </tr>
      </thead>
      <tbody>
        @for (row of rows(); track row.label) {
          <tr>
            <th scope="row">{{ row.label }}</th>
            <td>{{ row.before }}</td>
            <td>{{ row.after }}</td>
          </tr>
        }
      </tbody>
    </table>
    <p class="basis">
      Weather {{ c.weather.year }} at {{ c.weather.stationName }}: ETo {{ c.weather.etoIn | number: '1.1-1' }} in, rain
      {{ c.weather.rainIn | number: '1.1-1' }} in. Allowed ETAF {{ c.allowedEtaf }} — {{ c.allowedEtafSource }}.
    </p>
    <h4>Hydrozones</h4>
    <ul class="zones">
      @for (z of c.zones; track z.hydrozoneId) {
        <li>
          <strong>{{ z.name }}</strong>: {{ z.changes.length ? z.changes.join('; ') : 'unchanged' }} — ETAF
          {{ z.before.etaf | number: '1.2-2' }} → {{ z.after.areaFt2 > 0 ? (z.after.etaf | number: '1.2-2') : '—' }},
          {{ z.before.etwuGal | number: '1.0-0' }} → {{ z.after.etwuGal | number: '1.0-0' }} gal/yr
        </li>
      }
    </ul>
  `,
  styles: `
    .headline {
      display: grid;
      grid-template-columns: repeat(auto-fit, minmax(180px, 1fr));
      gap: 12px;
      margin-bottom: 16px;
      div {
        display: flex;
        flex-direction: column;
        padding: 12px;
        border-radius: 12px;
        background: var(--mat-sys-surface-container);
      }
      .k {
        color: var(--mat-sys-on-surface-variant);
        font-size: 0.85rem;
      }
      .v {
        font: var(--mat-sys-headline-small);
      }
    }
    .compare {
      width: 100%;
      border-collapse: collapse;
      th,
      td {
        padding: 6px 8px;
        border-bottom: 1px solid var(--mat-sys-outline-variant);
        text-align: right;
        overflow-wrap: anywhere;
      }
      th[scope='row'] {
        text-align: left;
        font-weight: 500;
      }
    }
    .basis {
      color: var(--mat-sys-on-surface-variant);
    }
    .zones {
      padding-left: 20px;
      overflow-wrap: anywhere;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanComparisonView {
  readonly comparison = input.required<PlanComparisonDto>();

  protected readonly rows = computed(() => {
    const c = this.comparison();
    const gal = (v: number) => `${Math.round(v).toLocaleString('en-US')} gal`;
    return [
      {
        label: 'Irrigated area',
        before: `${Math.round(c.before.landscapeAreaFt2).toLocaleString('en-US')} ft²`,
        after: `${Math.round(c.after.landscapeAreaFt2).toLocaleString('en-US')} ft²`,
      },
      { label: 'Allowance (MAWA)', before: gal(c.before.mawaGal), after: gal(c.after.mawaGal) },
      { label: 'Estimated use (ETWU)', before: gal(c.before.estimatedUseGal), after: gal(c.after.estimatedUseGal) },
      { label: 'Site-wide ETAF', before: c.before.sitewideEtaf.toFixed(2), after: c.after.sitewideEtaf.toFixed(2) },
      { label: 'Water cost per year', before: this.money(c.before.annualCost), after: this.money(c.after.annualCost) },
    ];
  });

  protected money(v: number | null): string {
    if (v === null) return '—';
    const c = this.comparison().currency;
    return `${v.toLocaleString('en-US', { minimumFractionDigits: 0, maximumFractionDigits: 0 })} ${c}`;
  }
}
