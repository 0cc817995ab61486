import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { ETAF_SORTS, type EtafSort } from '@shared/etaf/etaf-dto';
import { addMonths } from '@shared/portfolio/period';
import { SITE_KIND_LABELS, SITE_KINDS, type SiteKind } from '@shared/sites/site';
import { describeApiError } from '../../core/http/api-error';
import { EtafApi } from '../etaf-api';
import { EtafHistogram } from '../etaf-histogram/etaf-histogram';
import { lastTwelveMonths } from '../etaf-period';

const SORT_LABELS: Record<EtafSort, string> = {
  rank: 'Rank (lowest ETAF first)',
  achievedEtaf: 'Achieved ETAF',
  galPerFt2: 'Gallons per ft²',
  percentOfAllowance: '% of allowance',
  name: 'Site name',
};

/** `/etaf`: every visible site ranked by the ETAF it achieved, with the distribution; for every role. */
@Component({
  selector: 'rm-etaf-page',
  imports: [
    DecimalPipe,
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    EtafHistogram,
  ],
  templateUrl: './etaf-page.html',
  styleUrl: './etaf-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EtafPage {
  private readonly api = inject(EtafApi);

  protected readonly kinds = SITE_KINDS;
  protected readonly kindLabels = SITE_KIND_LABELS;
  protected readonly sorts = ETAF_SORTS;
  protected readonly sortLabels = SORT_LABELS;
  protected readonly from = signal(lastTwelveMonths().from);
  protected readonly to = signal(lastTwelveMonths().to);
  protected readonly kind = signal<SiteKind | null>(null);
  protected readonly sort = signal<EtafSort>('rank');
  protected readonly dir = signal<'asc' | 'desc'>('asc');
  protected readonly page = signal(0);
  protected readonly pageSize = signal(25);

  protected readonly report = rxResource({
    params: () => ({
      from: this.from(),
      to: this.to(),
      kind: this.kind(),
      sort: this.sort(),
      dir: this.dir(),
      page: this.page(),
      pageSize: this.pageSize(),
    }),
    stream: ({ params }) => this.api.report(params),
  });
  protected readonly error = computed(() => {
    const err = this.report.error();
    return err ? describeApiError(err, 'The ETAF ranking could not be loaded.').message : null;
  });

  protected setFilter(apply: () => void): void {
    apply();
    this.page.set(0);
  }

  protected lastMonths(n: number): void {
    const { to } = lastTwelveMonths();
    this.setFilter(() => {
      this.to.set(to);
      this.from.set(addMonths(to, -(n - 1)));
    });
  }

  protected turn(e: PageEvent): void {
    this.page.set(e.pageIndex);
    this.pageSize.set(e.pageSize);
  }
}
