import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { atLeast } from '@shared/auth/roles';
import type { ControllerDto, MeterDto, ZoneDto } from '@shared/meters/meter';
import { VOLUME_UNIT_LABELS } from '@shared/units/volume-units';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { HydrozonesApi } from '../../hydrozones/hydrozones-api';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { siteDate } from '../../sites/site-date';
import { SitesApi } from '../../sites/sites-api';
import { addController } from '../controller-form/controller-form';
import { editMeter } from '../meter-form/meter-form';
import { METER_PURPOSE_LABELS, WATER_SOURCE_LABELS } from '../meter-labels';
import { MetersApi } from '../meters-api';
import { editZone } from '../zone-form/zone-form';

/** `/sites/:id/equipment`: the site's meters, and its controllers with their zones; editable with `contribute`. */
@Component({
  selector: 'rm-equipment-page',
  imports: [DecimalPipe, MatTableModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './equipment-page.html',
  styleUrl: './equipment-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EquipmentPage {
  private readonly api = inject(MetersApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly hydrozonesApi = inject(HydrozonesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  /** Route parameter. */
  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));
  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly meters = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.api.meters(params),
  });
  protected readonly controllers = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.api.controllers(params),
  });
  protected readonly hydrozones = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.hydrozonesApi.list(params),
  });

  protected readonly canEdit = computed(() => this.site.hasValue() && atLeast(this.site.value().access, 'contribute'));
  protected readonly timeZone = computed(() => (this.site.hasValue() ? this.site.value().timeZone : 'UTC'));
  /** Hydrozones to link zones to; without them (still loading, or failed) zones show their id and can stay unlinked. */
  private readonly hydrozoneOptions = computed(() =>
    this.hydrozones.hasValue() ? this.hydrozones.value().items.map((h) => ({ id: h.id, name: h.name })) : [],
  );
  private readonly hydrozoneNames = computed(() => new Map(this.hydrozoneOptions().map((h) => [h.id, h.name])));
  protected readonly meterColumns = computed(() => [
    'ref',
    'unit',
    'multiplier',
    'digits',
    'purpose',
    'source',
    'installed',
    'removed',
    ...(this.canEdit() ? ['actions'] : []),
  ]);
  protected readonly zoneColumns = computed(() => [
    'station',
    'name',
    'hydrozone',
    'designGpm',
    'emitters',
    ...(this.canEdit() ? ['actions'] : []),
  ]);
  // Table rows are untyped in templates, so the label maps are read by plain string keys.
  protected readonly unitLabels: Record<string, string> = VOLUME_UNIT_LABELS;
  protected readonly purposeLabels: Record<string, string> = METER_PURPOSE_LABELS;
  protected readonly sourceLabels: Record<string, string> = WATER_SOURCE_LABELS;

  protected readonly metersError = computed(() =>
    errorOf(this.site.error() ?? this.meters.error(), 'The meters could not be loaded.'),
  );
  protected readonly controllersError = computed(() =>
    errorOf(this.controllers.error(), 'The controllers could not be loaded.'),
  );

  protected localDate(iso: string | null): string {
    return iso ? siteDate(this.timeZone(), new Date(iso)) : '—';
  }

  protected hydrozoneName(zone: ZoneDto): string {
    if (zone.hydrozoneId === null) return 'Not linked';
    return this.hydrozoneNames().get(zone.hydrozoneId) ?? `Hydrozone #${zone.hydrozoneId}`;
  }

  protected retryMeters(): void {
    if (this.site.error()) this.site.reload();
    this.meters.reload();
  }

  protected async addMeter(): Promise<void> {
    await this.openMeter(null);
  }

  protected async editMeter(meter: MeterDto): Promise<void> {
    await this.openMeter(meter);
  }

  protected async deleteMeter(meter: MeterDto): Promise<void> {
    const ok = await confirm(this.dialog, {
      title: 'Delete this meter?',
      message:
        `Meter “${meter.ref}” will be removed from this site. A meter ` +
        "with readings can't be deleted until the uploads that brought " +
        'them are rolled back.',
      confirmLabel: 'Delete meter',
      danger: true,
    });
    if (!ok) return;
    try {
      await firstValueFrom(this.api.deleteMeter(this.siteId(), meter.id));
      this.snackBar.open(`Meter “${meter.ref}” deleted.`, undefined, { duration: 3000 });
      this.meters.reload();
    } catch (err) {
      this.snackBar.open(describeApiError(err, 'The meter could not be deleted.').message, 'Close');
    }
  }

  protected async addController(): Promise<void> {
    const saved = await addController(this.dialog, this.siteId());
    if (saved) {
      this.snackBar.open(`Controller “${saved.name}” added.`, undefined, { duration: 3000 });
      this.controllers.reload();
    }
  }

  protected async addZone(controller: ControllerDto): Promise<void> {
    await this.openZone(controller, null);
  }

  protected async editZone(controller: ControllerDto, zone: ZoneDto): Promise<void> {
    await this.openZone(controller, zone);
  }

  private async openZone(controller: ControllerDto, zone: ZoneDto | null): Promise<void> {
    const saved = await editZone(this.dialog, {
      siteId: this.siteId(),
      controller,
      zone,
      hydrozones: this.hydrozoneOptions(),
    });
    if (saved) {
      this.snackBar.open(
        zone ? `Zone ${zone.station} on “${saved.name}” saved.` : `Zone added to “${saved.name}”.`,
        undefined,
        { duration: 3000 },
      );
      this.controllers.reload();
    }
  }

  private async openMeter(meter: MeterDto | null): Promise<void> {
    const saved = await editMeter(this.dialog, { siteId: this.siteId(), timeZone: this.timeZone(), meter });
    if (saved) {
      this.snackBar.open(`Meter “${saved.ref}” ${meter ? 'saved' : 'added'}.`, undefined, { duration: 3000 });
      this.meters.reload();
    }
  }
}

function errorOf(error: unknown, fallback: string): string | null {
  return error ? describeApiError(error, fallback).message : null;
}
