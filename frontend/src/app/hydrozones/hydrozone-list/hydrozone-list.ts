import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { atLeast } from '@shared/auth/roles';
import { SPECIAL_LANDSCAPE_KIND_LABELS, type HydrozoneDto } from '@shared/hydrozones/hydrozone-dto';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { UnitSystemStore } from '../../shared/unit-system/unit-system';
import { SitesApi } from '../../sites/sites-api';
import { editHydrozone } from '../hydrozone-form/hydrozone-form';
import { IRRIGATION_METHOD_LABELS } from '../hydrozone-labels';
import { HydrozonesApi } from '../hydrozones-api';
import { RunTimeAdvice } from '../run-time-advice/run-time-advice';

function previousMonth(): string {
  const now = new Date();
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 1, 1)).toISOString().slice(0, 7);
}

/** `/sites/:id/hydrozones`: the site's hydrozones, their editor and each zone's run-time advice. */
@Component({
  selector: 'rm-hydrozone-list',
  imports: [
    DecimalPipe,
    MatTableModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTooltipModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    RunTimeAdvice,
  ],
  templateUrl: './hydrozone-list.html',
  styleUrl: './hydrozone-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HydrozoneList {
  private readonly api = inject(HydrozonesApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly units = inject(UnitSystemStore);

  /** Route parameter. */
  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));
  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly zones = rxResource({ params: () => this.siteId(), stream: ({ params }) => this.api.list(params) });
  protected readonly rows = computed(() => (this.zones.hasValue() ? this.zones.value().items : []));
  protected readonly canEdit = computed(() =>
    atLeast(this.site.hasValue() ? this.site.value().access : 'read', 'contribute'),
  );
  protected readonly columns = computed(() => [
    'name',
    'area',
    'plantFactor',
    'method',
    'efficiency',
    'sla',
    'actions',
  ]);
  protected readonly methodLabels = IRRIGATION_METHOD_LABELS;
  protected readonly slaLabels = SPECIAL_LANDSCAPE_KIND_LABELS;
  protected readonly loadError = computed(() => {
    const err = this.site.error() ?? this.zones.error();
    return err ? describeApiError(err, 'The hydrozones could not be loaded.').message : null;
  });

  protected readonly adviceZone = signal<HydrozoneDto | null>(null);
  protected readonly adviceMonth = signal(previousMonth());
  protected readonly daysPerWeek = signal(3);
  protected readonly advice = rxResource({
    params: () => {
      const zone = this.adviceZone();
      return zone ? { zoneId: zone.id, month: this.adviceMonth(), days: this.daysPerWeek() } : undefined;
    },
    stream: ({ params }) => this.api.advice(this.siteId(), params.zoneId, params.month, params.days),
  });
  protected readonly adviceError = computed(() => {
    const err = this.advice.error();
    return err ? describeApiError(err, 'No advice could be worked out.').message : null;
  });

  constructor() {
    void this.units.ensureLoaded();
  }

  protected methodLabel(zone: HydrozoneDto): string {
    return this.methodLabels[zone.irrigationMethod];
  }

  protected slaLabel(zone: HydrozoneDto): string {
    return zone.specialLandscapeArea && zone.specialLandscapeKind ? this.slaLabels[zone.specialLandscapeKind] : '—';
  }

  protected async addZone(): Promise<void> {
    const saved = await editHydrozone(this.dialog, {
      siteId: this.siteId(),
      zone: null,
      areaUnit: this.units.metric() ? 'm2' : 'ft2',
    });
    if (saved) {
      this.snackBar.open(`“${saved.name}” added.`, undefined, { duration: 3000 });
      this.zones.reload();
    }
  }

  protected async editZone(zone: HydrozoneDto): Promise<void> {
    const saved = await editHydrozone(this.dialog, {
      siteId: this.siteId(),
      zone,
      areaUnit: this.units.metric() ? 'm2' : 'ft2',
    });
    if (saved) {
      this.snackBar.open(`“${saved.name}” saved.`, undefined, { duration: 3000 });
      this.zones.reload();
      if (this.adviceZone()?.id === saved.id) this.adviceZone.set(saved);
    }
  }

  protected async deleteZone(zone: HydrozoneDto): Promise<void> {
    const ok = await confirm(this.dialog, {
      title: 'Delete this hydrozone?',
      message: `“${zone.name}” will no longer count in this site's budget.`,
      confirmLabel: 'Delete hydrozone',
      danger: true,
    });
    if (!ok) return;
    try {
      await firstValueFrom(this.api.remove(this.siteId(), zone.id));
      if (this.adviceZone()?.id === zone.id) this.adviceZone.set(null);
      this.zones.reload();
    } catch (err) {
      this.snackBar.open(describeApiError(err, 'The hydrozone could not be deleted.').message, 'Close');
    }
  }

  protected showAdvice(zone: HydrozoneDto): void {
    this.adviceZone.set(zone);
  }

  protected setMonth(value: string): void {
    if (/^\d{4}-\d{2}$/.test(value)) this.adviceMonth.set(value);
  }
}
