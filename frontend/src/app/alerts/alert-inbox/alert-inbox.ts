import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { Sort } from '@angular/material/sort';
import { RouterLink } from '@angular/router';
import type { Page } from '@shared/api/page';
import {
  ALERT_STATUSES,
  KIND_LABELS,
  type AlertSort,
  type AlertStatus,
  type AlertSummaryDto,
} from '@shared/alerts/alert-dto';
import { FINDING_KINDS, type FindingKind } from '@shared/watch/finding';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { SitesApi } from '../../sites/sites-api';
import { AlertTable } from '../alert-table/alert-table';
import { AlertsApi, type AlertQuery } from '../alerts-api';

/** Every alert on the sites the user can see, as a server-side filtered, sorted and paged table. */
@Component({
  selector: 'rm-alert-inbox',
  host: { class: 'rm-page' },
  imports: [
    RouterLink,
    AlertTable,
    MatPaginatorModule,
    MatProgressBarModule,
    MatFormFieldModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
  ],
  templateUrl: './alert-inbox.html',
  styleUrl: './alert-inbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AlertInbox {
  private readonly api = inject(AlertsApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly auth = inject(AuthStore);
  protected readonly isAdmin = computed(() => this.auth.capabilities().manageSettings);

  protected readonly kinds = FINDING_KINDS;
  protected readonly statuses = ALERT_STATUSES;
  protected readonly kindLabels: Record<string, string> = KIND_LABELS;

  // Everything the request depends on; the table's events only set these.
  protected readonly status = signal<AlertStatus | ''>('open');
  protected readonly kind = signal<FindingKind | ''>('');
  protected readonly siteId = signal<number | null>(null);
  protected readonly sort = signal<AlertSort>('detected');
  protected readonly dir = signal<'asc' | 'desc'>('desc');
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);

  private readonly query = computed<AlertQuery>(() => ({
    status: this.status(),
    kind: this.kind(),
    siteId: this.siteId(),
    page: this.pageIndex(),
    pageSize: this.pageSize(),
    sort: this.sort(),
    dir: this.dir(),
  }));
  protected readonly alerts = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.list(params) });
  protected readonly sites = rxResource({
    stream: () => this.sitesApi.list({ page: 0, pageSize: 200, sort: 'name', dir: 'asc', q: '', tag: '', kind: '' }),
  });

  /** The last page received, kept while the next one loads so the table doesn't blink. */
  private readonly shown = linkedSignal<Page<AlertSummaryDto> | undefined, Page<AlertSummaryDto> | undefined>({
    source: () => (this.alerts.hasValue() ? this.alerts.value() : undefined),
    computation: (page, previous) => page ?? previous?.value,
  });
  protected readonly rows = computed(() => this.shown()?.items ?? []);
  protected readonly total = computed(() => this.shown()?.total ?? 0);
  protected readonly loading = this.alerts.isLoading;
  protected readonly errorMessage = computed(() => {
    const error = this.alerts.error();
    return error ? describeApiError(error, 'The alerts could not be loaded.').message : null;
  });
  protected readonly siteOptions = computed(() => (this.sites.hasValue() ? this.sites.value().items : []));

  protected filterStatus(value: AlertStatus | ''): void {
    this.status.set(value);
    this.pageIndex.set(0);
  }

  protected filterKind(value: FindingKind | ''): void {
    this.kind.set(value);
    this.pageIndex.set(0);
  }

  protected filterSite(value: number | null): void {
    this.siteId.set(value);
    this.pageIndex.set(0);
  }

  protected sortBy(sort: Sort): void {
    const column: Record<string, AlertSort> = {
      severity: 'severity',
      siteName: 'site',
      period: 'period',
      waterLost: 'waterLost',
    };
    this.sort.set(sort.direction ? (column[sort.active] ?? 'detected') : 'detected');
    this.dir.set(sort.direction === 'asc' ? 'asc' : 'desc');
    this.pageIndex.set(0);
  }

  protected turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.pageSize.set(event.pageSize);
  }
}
