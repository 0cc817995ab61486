import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { SAVINGS_CHANGE_LABELS } from '@shared/savings/savings-project-dto';
import { describeApiError } from '../../core/http/api-error';
import { SavingsApi } from '../savings-api';
import { SavingsChart } from '../savings-chart/savings-chart';
import { ProjectHistory } from '../project-history/project-history';

/** `/reports/savings/:id`: the savings figure, the chart, the Guideline 14 checks and the verdict in plain words. */
@Component({
  selector: 'rm-savings-report',
  imports: [
    DecimalPipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTableModule,
    SavingsChart,
    ProjectHistory,
  ],
  templateUrl: './savings-report.html',
  styleUrl: './savings-report.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SavingsReport {
  private readonly api = inject(SavingsApi);
  /** Bound from the route parameter. */
  readonly id = input.required<number, string>({ transform: Number });

  protected readonly labels = SAVINGS_CHANGE_LABELS;
  protected readonly checkColumns = ['label', 'value', 'limit', 'result', 'source'];
  protected readonly report = rxResource({
    params: () => this.id(),
    stream: ({ params }) => this.api.savingsReport(params),
  });
  protected readonly error = computed(() => {
    const err = this.report.error();
    return err ? describeApiError(err, 'The savings report could not be computed.').message : null;
  });
  protected readonly csvUrl = computed(() => this.api.savingsExportUrl(this.id(), 'csv'));
  protected readonly pdfUrl = computed(() => this.api.savingsExportUrl(this.id(), 'pdf'));
  protected readonly handoutUrl = computed(() => this.api.handoutUrl(this.id()));
}
