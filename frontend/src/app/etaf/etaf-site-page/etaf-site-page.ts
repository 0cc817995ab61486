import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { atLeast } from '@shared/auth/roles';
import { ETAF_BASES, ETAF_BASIS_LABELS, type EtafBasis } from '@shared/etaf/etaf-dto';
import { MWELO_MAX_ETAF } from '@shared/budgets/mwelo-allowance';
import { SITE_KIND_LABELS } from '@shared/sites/site';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { SitesApi } from '../../sites/sites-api';
import { EtafApi } from '../etaf-api';
import { EtafHistogram } from '../etaf-histogram/etaf-histogram';
import { lastTwelveMonths } from '../etaf-period';

/** `/etaf/sites/:siteId`: one site's achieved ETAF among comparable sites, and its allowed ETAF (editors set it). */
@Component({
  selector: 'rm-etaf-site-page',
  imports: [
    DecimalPipe,
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    EtafHistogram,
  ],
  templateUrl: './etaf-site-page.html',
  styleUrl: './etaf-site-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EtafSitePage {
  private readonly api = inject(EtafApi);
  private readonly sitesApi = inject(SitesApi);

  readonly siteId = input.required<number, string>({ transform: Number });
  /** Query parameters; the last twelve months when absent. */
  readonly from = input<string | undefined>(undefined);
  readonly to = input<string | undefined>(undefined);
  private readonly period = computed(() => ({
    from: this.from() ?? lastTwelveMonths().from,
    to: this.to() ?? lastTwelveMonths().to,
  }));

  protected readonly kindLabels = SITE_KIND_LABELS;
  protected readonly bases = ETAF_BASES;
  protected readonly basisLabels = ETAF_BASIS_LABELS;
  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly standing = rxResource({
    params: () => ({ id: this.siteId(), ...this.period() }),
    stream: ({ params }) => this.api.standing(params.id, params.from, params.to),
  });
  protected readonly canEdit = computed(() => this.site.hasValue() && atLeast(this.site.value().access, 'edit'));
  protected readonly error = computed(() => {
    const err = this.standing.error();
    return err ? describeApiError(err, 'The site could not be loaded.').message : null;
  });

  protected readonly editing = signal(false);
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected basis: EtafBasis = 'non-residential';
  protected allowedEtaf = 0.45;

  protected startEdit(): void {
    const s = this.standing.value()!.setting;
    this.basis = s.basis;
    this.allowedEtaf = s.allowedEtaf;
    this.editing.set(true);
  }

  protected pickBasis(basis: EtafBasis): void {
    this.basis = basis;
    if (basis !== 'local') this.allowedEtaf = MWELO_MAX_ETAF[basis];
  }

  protected async save(): Promise<void> {
    this.saving.set(true);
    this.formError.set(null);
    try {
      await firstValueFrom(
        this.api.saveSetting(this.siteId(), { basis: this.basis, allowedEtaf: Number(this.allowedEtaf) }),
      );
      this.editing.set(false);
      this.standing.reload();
    } catch (err) {
      this.formError.set(describeApiError(err, 'The setting could not be saved.').message);
    } finally {
      this.saving.set(false);
    }
  }
}
