import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { ComplianceDto } from '@shared/budgets/budget-dto';

/** The year's MWELO allowance against estimated use, with the worksheet lines (display only). */
@Component({
  selector: 'rm-compliance-card',
  imports: [DecimalPipe, MatIconModule],
  template: `
    @let c = compliance();
    <p class="verdict" [class.fails]="!c.complies">
      <mat-icon aria-hidden="true">{{ c.complies ? 'task_alt' : 'report' }}</mat-icon>
      {{ c.complies ? 'Within the allowance' : 'Over the allowance' }} ({{ c.projectType }}, {{ c.projectTypeSource }})
    </p>
    @for (r of c.reasons; track r) {
      <p class="reason">{{ r }}</p>
    }
    <table aria-label="MWELO worksheet">
      <tbody>
        @for (s of c.steps; track s.label) {
          <tr>
            <th scope="row">{{ s.label }}</th>
            <td class="formula">{{ s.formula }}</td>
            <td class="num">{{ s.value | number: '1.0-2' }} {{ s.unit }}</td>
          </tr>
        }
        <tr>
          <th scope="row">Sitewide ETAF</th>
          <td class="formula">(Σ ETAF × area) ÷ Σ area</td>
          <td class="num">{{ c.sitewideEtaf | number: '1.2-2' }}</td>
        </tr>
      </tbody>
    </table>
    @if (c.filledDays > 0) {
      <p class="note">{{ c.filledDays }} day(s) of {{ c.year }} come from the station's monthly normals.</p>
    }
  `,
  styles: `
    .verdict {
      display: flex;
      gap: 8px;
      align-items: center;
      font: var(--mat-sys-title-medium);
      color: var(--mat-sys-primary);
    }
    .verdict.fails {
      color: var(--mat-sys-error);
    }
    .reason {
      margin: 4px 0;
    }
    table {
      border-collapse: collapse;
      width: 100%;
    }
    th,
    td {
      text-align: left;
      padding: 3px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
    .num {
      text-align: right;
      white-space: nowrap;
    }
    .formula,
    .note {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ComplianceCard {
  readonly compliance = input.required<ComplianceDto>();
}
