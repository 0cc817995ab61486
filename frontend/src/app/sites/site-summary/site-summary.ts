import { booleanAttribute, ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatChipsModule } from '@angular/material/chips';
import type { OrganisationKind } from '@shared/auth/roles';
import { SITE_KIND_LABELS, type SiteDto } from '@shared/sites/site';
import { SITE_LEVEL_LABELS } from '../site-labels';

const ORGANISATION_KIND_LABELS: Record<OrganisationKind, string> = {
  'property-manager': 'Property manager',
  contractor: 'Landscape contractor',
  utility: 'Utility',
};

/** A site's identity and shares as read-only text (for users below 'edit', and the shares under the form). */
@Component({
  selector: 'rm-site-summary',
  imports: [MatChipsModule],
  templateUrl: './site-summary.html',
  styleUrl: './site-summary.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteSummary {
  readonly site = input.required<SiteDto>();
  /** Shows only the shares, under an editable form. */
  readonly sharesOnly = input(false, { transform: booleanAttribute });

  protected readonly kindLabels = SITE_KIND_LABELS;
  protected readonly levelLabels = SITE_LEVEL_LABELS;
  protected readonly organisationKindLabels = ORGANISATION_KIND_LABELS;
  protected readonly shareLabels = { contribute: 'May contribute', read: 'May view' } as const;

  protected sharedOn(iso: string): string {
    return new Intl.DateTimeFormat('en-US', { dateStyle: 'medium' }).format(new Date(iso));
  }
}
