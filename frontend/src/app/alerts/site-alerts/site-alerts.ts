import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { AlertStatus } from '@shared/alerts/alert-dto';
import { describeApiError } from '../../core/http/api-error';
import { AlertTable } from '../alert-table/alert-table';
import { AlertsApi } from '../alerts-api';

/** `/sites/:id/alerts`: the site's alerts from the nightly watch; each opens the alert's own page. */
@Component({
  selector: 'rm-site-alerts',
  imports: [
    RouterLink,
    AlertTable,
    MatPaginatorModule,
    MatProgressBarModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatIconModule,
  ],
  templateUrl: './site-alerts.html',
  styleUrl: './site-alerts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteAlerts {
  private readonly api = inject(AlertsApi);

  /** Route parameter. */
  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));
  protected readonly status = signal<AlertStatus | ''>('open');
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  protected readonly alerts = rxResource({
    params: () => ({ siteId: this.siteId(), status: this.status(), page: this.pageIndex(), pageSize: this.pageSize() }),
    stream: ({ params }) => this.api.list({ ...params, kind: '', sort: 'detected', dir: 'desc' }),
  });
  protected readonly rows = computed(() => (this.alerts.hasValue() ? this.alerts.value().items : []));
  protected readonly total = computed(() => (this.alerts.hasValue() ? this.alerts.value().total : 0));
  protected readonly error = computed(() =>
    this.alerts.error() ? describeApiError(this.alerts.error(), 'The alerts could not be loaded.').message : null,
  );

  protected readonly emptyText = computed(() => {
    if (this.alerts.isLoading()) return '';
    const status = this.status();
    return (
      `${status ? `No ${status} alerts at this site.` : 'No alerts at this site yet.'} ` +
      "The watch checks the site's data every night."
    );
  });

  protected filterStatus(value: AlertStatus | ''): void {
    this.status.set(value);
    this.pageIndex.set(0);
  }

  protected turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
  }
}
