import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, effect, inject, linkedSignal, signal } from '@angular/core';
import { rxResource, takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { DEFAULT_PAGE_SIZE, type Page, type SortDirection } from '@shared/api/page';
import {
  SITE_KIND_LABELS,
  SITE_KINDS,
  SITE_SORTS,
  type SiteDto,
  type SiteKind,
  type SiteSort,
} from '@shared/sites/site';
import { debounceTime, distinctUntilChanged, map } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { SITE_LEVEL_LABELS } from '../site-labels';
import { SitesApi, type SiteQuery } from '../sites-api';
import { siteQueryFromUrl, siteQueryToUrl } from './site-list-url';

const ALL_COLUMNS = ['name', 'kind', 'address', 'timeZone', 'tags', 'organisationName', 'access'];
const PHONE_COLUMNS = ['name', 'kind', 'access'];

/** The sites the user's organisation owns or has been shared, as a server-side sorted, filtered, paged table. */
@Component({
  selector: 'rm-site-list',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatChipsModule,
    MatButtonModule,
    MatIconModule,
  ],
  templateUrl: './site-list.html',
  styleUrl: './site-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteList {
  private readonly api = inject(SitesApi);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly auth = inject(AuthStore);
  private readonly initial = siteQueryFromUrl(this.route.snapshot.queryParamMap);

  protected readonly canCreate = computed(() => this.auth.capabilities().createSites);
  protected readonly kinds = SITE_KINDS;
  // Table rows are untyped in templates, hence the string-keyed views of the label maps.
  protected readonly kindLabels: Record<string, string> = SITE_KIND_LABELS;
  protected readonly levelLabels: Record<string, string> = SITE_LEVEL_LABELS;
  protected readonly pageSizeOptions = [10, DEFAULT_PAGE_SIZE, 50, 100];

  // Everything the request depends on; the table's events only set these.
  protected readonly sort = signal<SiteSort>(this.initial.sort);
  protected readonly dir = signal<SortDirection>(this.initial.dir);
  protected readonly pageIndex = signal(this.initial.page);
  protected readonly pageSize = signal(this.initial.pageSize);
  protected readonly q = signal(this.initial.q);
  protected readonly tag = signal(this.initial.tag);
  protected readonly kind = signal<SiteKind | ''>(this.initial.kind);

  protected readonly search = new FormControl(this.initial.q, { nonNullable: true });

  private readonly query = computed<SiteQuery>(() => ({
    page: this.pageIndex(),
    pageSize: this.pageSize(),
    sort: this.sort(),
    dir: this.dir(),
    q: this.q(),
    tag: this.tag(),
    kind: this.kind(),
  }));

  protected readonly sites = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.list(params) });
  protected readonly tags = rxResource({ stream: () => this.api.tags() });

  /** The last page received, kept while the next one loads so the table doesn't blink. */
  private readonly shown = linkedSignal<Page<SiteDto> | undefined, Page<SiteDto> | undefined>({
    source: () => (this.sites.hasValue() ? this.sites.value() : undefined),
    computation: (page, previous) => page ?? previous?.value,
  });
  protected readonly rows = computed(() => this.shown()?.items ?? []);
  protected readonly total = computed(() => this.shown()?.total ?? 0);
  protected readonly loading = this.sites.isLoading;
  protected readonly errorMessage = computed(() => {
    const error = this.sites.error();
    return error ? describeApiError(error, 'The sites could not be loaded.').message : null;
  });
  protected readonly filtered = computed(() => !!(this.q() || this.tag() || this.kind()));
  protected readonly tagOptions = computed(() => (this.tags.hasValue() ? this.tags.value() : []));

  private readonly phone = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 720px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly columns = computed(() => (this.phone() ? PHONE_COLUMNS : ALL_COLUMNS));

  constructor() {
    // Mirror the view into the address bar without adding history entries.
    effect(() => {
      const queryParams = siteQueryToUrl(this.query());
      void this.router
        .navigate([], { relativeTo: this.route, queryParams, queryParamsHandling: 'merge', replaceUrl: true })
        .catch(() => false);
    });
    this.search.valueChanges
      .pipe(
        map((text) => text.trim()),
        debounceTime(300),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((text) => this.filterBy(() => this.q.set(text)));
  }

  protected sortBy(event: Sort): void {
    const active = SITE_SORTS.find((sort) => sort === event.active);
    // Clearing the sort (third click) falls back to name, ascending: the server always needs an order.
    this.sort.set(active && event.direction ? active : 'name');
    this.dir.set(active && event.direction ? event.direction : 'asc');
    this.pageIndex.set(0);
  }

  protected changePage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }

  protected filterByTag(tag: string): void {
    this.filterBy(() => this.tag.set(tag));
  }

  protected filterByKind(kind: SiteKind | ''): void {
    this.filterBy(() => this.kind.set(kind));
  }

  protected clearFilters(): void {
    this.search.setValue('', { emitEvent: false });
    this.filterBy(() => {
      this.q.set('');
      this.tag.set('');
      this.kind.set('');
    });
  }

  protected openSite(site: SiteDto): void {
    void this.router.navigate(['/sites', site.id]);
  }

  protected retry(): void {
    this.sites.reload();
  }

  /** A new filter starts again from the first page. */
  private filterBy(change: () => void): void {
    change();
    this.pageIndex.set(0);
  }
}
