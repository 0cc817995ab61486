import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { KIND_LABELS, SEVERITY_LABELS, SUB_KIND_LABELS, type AlertSummaryDto } from '@shared/alerts/alert-dto';
import { gallons, money, siteTime } from '../site-time';

/**
 * A page of alerts: urgency, what (linking to the alert), site, since when, water and money lost, status. Display only.
 */
@Component({
  selector: 'rm-alert-table',
  imports: [RouterLink, MatTableModule, MatSortModule],
  templateUrl: './alert-table.html',
  styleUrl: './alert-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AlertTable {
  readonly alerts = input.required<AlertSummaryDto[]>();
  /** The table's accessible name. */
  readonly label = input.required<string>();
  /** Off inside one site's pages, where every row is the same site. */
  readonly showSite = input(true);
  readonly sortable = input(false);
  /** Shown in the table's single row when there are no alerts ('' while loading). */
  readonly emptyText = input('');
  readonly sortChange = output<Sort>();

  protected readonly columns = computed(() => [
    'severity',
    'kind',
    ...(this.showSite() ? ['siteName'] : []),
    'period',
    'waterLost',
    'moneyLost',
    'status',
  ]);
  protected readonly kindLabels: Record<string, string> = KIND_LABELS;
  protected readonly subKindLabels: Record<string, string> = SUB_KIND_LABELS;
  protected readonly severityLabels: Record<string, string> = SEVERITY_LABELS;
  protected readonly siteTime = siteTime;
  protected readonly gallons = gallons;
  protected readonly money = money;
}
