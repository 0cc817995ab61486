import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import {
  SAVINGS_PROJECT_STATUS_LABELS,
  SAVINGS_PROJECT_STATUSES,
  SAVINGS_STANDING_LABELS,
  type SavingsProjectStatus,
} from '@shared/savings/savings-project-dto';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { LoadError } from '../../shared/load-error/load-error';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';
import { SavingsApi } from '../savings-api';

/** `/reports/savings`: the savings book — every project across sites with what it saved to date and its verdict. */
@Component({
  selector: 'rm-savings-book',
  imports: [
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    LoadError,
  ],
  templateUrl: './savings-book.html',
  styleUrl: './savings-book.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SavingsBook {
  private readonly api = inject(SavingsApi);
  private readonly auth = inject(AuthStore);
  protected readonly units = inject(UnitSystemStore);

  protected readonly statuses = SAVINGS_PROJECT_STATUSES;
  protected readonly statusLabels: Record<string, string> = SAVINGS_PROJECT_STATUS_LABELS;
  protected readonly standingLabels: Record<string, string> = SAVINGS_STANDING_LABELS;
  protected readonly columns = ['project', 'status', 'standing', 'water', 'money', 'actions'];
  /** Contractors start with their firm's own projects; others with everything they can see. */
  protected readonly scope = signal<'mine' | 'all'>(
    this.auth.user()?.organisation.role === 'contractor' ? 'mine' : 'all',
  );
  protected readonly status = signal<SavingsProjectStatus | null>(null);
  protected readonly book = rxResource({
    params: () => ({
      scope: this.scope(),
      status: this.status(),
      page: 0,
      pageSize: 100,
      sort: 'installedOn' as const,
      dir: 'desc' as const,
    }),
    stream: ({ params }) => this.api.book(params),
  });
  protected readonly error = computed(() =>
    this.book.error() ? describeApiError(this.book.error(), 'The savings book could not be loaded.').message : null,
  );

  constructor() {
    void this.units.ensureLoaded();
  }

  protected volume(gallons: number | null): string {
    return gallons === null ? '—' : this.units.volume(gallons);
  }

  protected money(amount: number | null, currency: string | null): string {
    if (amount === null || currency === null) return '—';
    return new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(amount);
  }

  protected handoutUrl(id: number): string {
    return this.api.handoutUrl(id);
  }
}
