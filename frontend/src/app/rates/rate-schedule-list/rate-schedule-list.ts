import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { atLeast } from '@shared/auth/roles';
import type { RateScheduleDto } from '@shared/rates/rate-schedule-dto';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { SitesApi } from '../../sites/sites-api';
import { editRateSchedule } from '../rate-schedule-form/rate-schedule-form';
import { RatesApi } from '../rates-api';

/** `/sites/:id/rates`: the site's water rate schedules; each applies from its date until the next starts. */
@Component({
  selector: 'rm-rate-schedule-list',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule],
  templateUrl: './rate-schedule-list.html',
  styles: `
    table {
      width: 100%;
    }
    .actions {
      text-align: right;
      white-space: nowrap;
    }
    td.mat-cell {
      padding-top: 8px;
      padding-bottom: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RateScheduleList {
  private readonly api = inject(RatesApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));
  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly schedules = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.api.list(params),
  });
  protected readonly canEdit = computed(() =>
    atLeast(this.site.hasValue() ? this.site.value().access : 'read', 'contribute'),
  );
  protected readonly columns = ['effectiveFrom', 'name', 'fixed', 'charge', 'actions'];
  protected readonly error = computed(() => {
    const err = this.site.error() ?? this.schedules.error();
    return err ? describeApiError(err, 'The rate schedules could not be loaded.').message : null;
  });

  protected describe(s: RateScheduleDto): string {
    const unit = s.unit === 'ccf' ? 'CCF' : 'kgal';
    const money = (n: number) => new Intl.NumberFormat('en-US', { style: 'currency', currency: s.currency }).format(n);
    const c = s.volumeCharge;
    if (c.kind === 'uniform') return `${money(c.pricePerUnit)} per ${unit}`;
    if (c.kind === 'tiered')
      return c.tiers
        .map((t) => `${t.upToUnits === null ? 'above' : `to ${t.upToUnits} ${unit}`}: ${money(t.pricePerUnit)}`)
        .join(' · ');
    return c.tiers
      .map(
        (t) =>
          `${t.upToPercentOfBudget === null ? 'above' : `to ${t.upToPercentOfBudget} % of budget`}: ` +
          `${money(t.pricePerUnit)}/${unit}`,
      )
      .join(' · ');
  }

  protected money(s: RateScheduleDto): string {
    return new Intl.NumberFormat('en-US', { style: 'currency', currency: s.currency }).format(s.fixedChargePerPeriod);
  }

  protected async edit(schedule: RateScheduleDto | null): Promise<void> {
    if (await editRateSchedule(this.dialog, { siteId: this.siteId(), schedule })) this.schedules.reload();
  }

  protected async remove(s: RateScheduleDto): Promise<void> {
    if (
      !(await confirm(this.dialog, {
        title: 'Delete this rate schedule?',
        message: `“${s.name}” from ${s.effectiveFrom} will no longer price the budget.`,
        confirmLabel: 'Delete schedule',
        danger: true,
      }))
    )
      return;
    try {
      await firstValueFrom(this.api.remove(this.siteId(), s.id));
      this.schedules.reload();
    } catch (err) {
      this.snackBar.open(describeApiError(err, 'The schedule could not be deleted.').message, 'Close');
    }
  }
}
