import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { SITE_KIND_LABELS } from '@shared/sites/site';
import { formatVolume } from '@shared/units/format-quantity';
import { map } from 'rxjs';
import { AlertsApi } from '../../alerts/alerts-api';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { dataAge } from '../../portfolio/sites-table/data-age';
import { ReadingsApi } from '../../readings/readings-api';
import { SitesApi } from '../sites-api';
import { monthToDateLabel, siteDate } from '../site-date';

interface Tab {
  /** Below /sites/:id; '' is the details form. */
  path: string;
  label: string;
}

export const SITE_TABS: readonly Tab[] = [
  { path: 'overview', label: 'Overview' },
  { path: 'monthly', label: 'Monthly table' },
  { path: 'hydrozones', label: 'Hydrozones' },
  { path: 'equipment', label: 'Meters & zones' },
  { path: 'alerts', label: 'Alerts' },
  { path: 'uploads', label: 'Uploads' },
  { path: 'budget', label: 'Water budget' },
  { path: 'rates', label: 'Rates' },
  { path: 'audits', label: 'Audits' },
  { path: 'planner', label: 'Planner' },
  { path: '', label: 'Details' },
];

/**
 * `/sites/:id/...`: the site's name and this month's figures on top, a tab per view of the site, the view below.
 * The pages in the tabs keep their own data; this frame only reads what the header shows.
 */
@Component({
  selector: 'rm-site-workspace',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatTabsModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
  ],
  templateUrl: './site-workspace.html',
  styleUrl: './site-workspace.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteWorkspace {
  private readonly sitesApi = inject(SitesApi);
  private readonly overviewApi = inject(ReadingsApi);
  private readonly alertsApi = inject(AlertsApi);

  /** Route parameter. */
  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));
  private readonly auth = inject(AuthStore);
  /** What-if plans are not shown to auditors (the server refuses them too). */
  protected readonly tabs = computed(() =>
    SITE_TABS.filter((t) => t.path !== 'planner' || this.auth.user()?.organisation.role !== 'auditor'),
  );
  protected readonly kindLabels = SITE_KIND_LABELS;

  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  /** Month to date on the site's clock; needs the site's zone first. */
  private readonly today = computed(() => (this.site.hasValue() ? siteDate(this.site.value().timeZone) : undefined));
  protected readonly figures = rxResource({
    params: () => {
      const today = this.today();
      return today ? { id: this.siteId(), today } : undefined;
    },
    stream: ({ params }) => this.overviewApi.overview(params.id, `${params.today.slice(0, 7)}-01`, params.today),
  });
  /** Every open alert of the site, whatever period it belongs to. */
  protected readonly openAlerts = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) =>
      this.alertsApi
        .list({ status: 'open', kind: '', siteId: params, page: 0, pageSize: 1, sort: 'detected', dir: 'desc' })
        .pipe(map((page) => page.total)),
  });

  protected readonly siteName = computed(() => (this.site.hasValue() ? this.site.value().name : 'Site'));
  protected readonly openAlertCount = computed(() => (this.openAlerts.hasValue() ? this.openAlerts.value() : null));
  protected readonly periodLabel = computed(() => {
    const today = this.today();
    return today ? monthToDateLabel(today) : '';
  });
  protected readonly siteError = computed(() => {
    const err = this.site.error();
    if (!err) return null;
    const problem = describeApiError(err, 'The site could not be loaded.');
    return problem.status === 404 ? 'There is no site at this address, or it is not shared with you.' : problem.message;
  });
  protected readonly figuresError = computed(() =>
    this.figures.error() || this.openAlerts.error() ? 'This month’s figures could not be loaded.' : null,
  );
  protected readonly loading = computed(
    () => this.site.isLoading() || this.figures.isLoading() || this.openAlerts.isLoading(),
  );

  protected gallons(value: number | null): string {
    return value === null ? 'no budget' : formatVolume(value, 'gal');
  }

  protected percent(value: number | null): string {
    return value === null ? '—' : `${Math.round(value).toLocaleString('en-US')} %`;
  }

  protected age(iso: string | null): string {
    return dataAge(iso, Date.now());
  }

  protected link(tab: Tab): unknown[] {
    return tab.path ? ['/sites', this.siteId(), tab.path] : ['/sites', this.siteId()];
  }

  protected reloadFigures(): void {
    if (this.figures.error()) this.figures.reload();
    if (this.openAlerts.error()) this.openAlerts.reload();
  }
}
