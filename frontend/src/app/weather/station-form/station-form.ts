import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  WEATHER_STATION_LIMITS,
  type StationExposure,
  type StationSourceKind,
  type WeatherStationDto,
  type WeatherStationInput,
} from '@shared/weather/weather-station-dto';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { WeatherApi } from '../weather-api';

/** Creates or edits a weather station in a dialog; closes with the saved station. */
@Component({
  selector: 'rm-station-form',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
  ],
  template: `
    <h2 mat-dialog-title>{{ station ? 'Edit weather station' : 'New weather station' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="grid">
        @if (saveError(); as message) {
          <div class="rm-form-error wide" role="alert">
            <mat-icon aria-hidden="true">error</mat-icon><span>{{ message }}</span>
          </div>
        }
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Station name</mat-label>
          <input matInput formControlName="name" required [maxlength]="limits.nameMax" />
          @if (form.controls.name.hasError('required')) {
            <mat-error>Give the station a name.</mat-error>
          } @else if (form.controls.name.hasError('server')) {
            <mat-error>{{ form.controls.name.getError('server') }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Latitude</mat-label>
          <input matInput type="number" formControlName="latitude" required step="any" /><span matTextSuffix>°</span>
          @if (form.controls.latitude.invalid) {
            <mat-error>−90 to 90 degrees (north positive).</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Longitude</mat-label>
          <input matInput type="number" formControlName="longitude" required step="any" /><span matTextSuffix>°</span>
          @if (form.controls.longitude.invalid) {
            <mat-error>−180 to 180 degrees (east positive).</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Elevation</mat-label>
          <input matInput type="number" formControlName="elevationM" required step="any" /><span matTextSuffix>m</span>
          @if (form.controls.elevationM.invalid) {
            <mat-error>−450 to 9,000 m.</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Wind measured at</mat-label>
          <input matInput type="number" formControlName="windHeightM" required step="any" /><span matTextSuffix>m</span>
          @if (form.controls.windHeightM.invalid) {
            <mat-error>0.5 to 100 m above ground.</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Exposure</mat-label>
          <mat-select formControlName="exposure">
            <mat-option value="interior">Interior (kRs 0.16)</mat-option>
            <mat-option value="coastal">Coastal (kRs 0.19)</mat-option>
          </mat-select>
          <mat-hint>Used when radiation must be estimated from temperatures.</mat-hint>
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Data usually comes from</mat-label>
          <mat-select formControlName="sourceKind">
            <mat-option value="upload">File uploads</mat-option>
            <mat-option value="feed">The weather feed</mat-option>
          </mat-select>
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving()">
          {{ station ? 'Save station' : 'Create station' }}
        </button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(2, minmax(0, 1fr));
      gap: 4px 16px;
    }
    .wide {
      grid-column: 1 / -1;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationForm {
  private readonly api = inject(WeatherApi);
  private readonly ref = inject<MatDialogRef<StationForm, WeatherStationDto>>(MatDialogRef);
  protected readonly station = inject<WeatherStationDto | null>(MAT_DIALOG_DATA);
  protected readonly limits = WEATHER_STATION_LIMITS;
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.station?.name ?? '', [Validators.required, Validators.maxLength(WEATHER_STATION_LIMITS.nameMax)]],
    latitude: [
      this.station?.latitude ?? (null as number | null),
      [Validators.required, Validators.min(-90), Validators.max(90)],
    ],
    longitude: [
      this.station?.longitude ?? (null as number | null),
      [Validators.required, Validators.min(-180), Validators.max(180)],
    ],
    elevationM: [
      this.station?.elevationM ?? (null as number | null),
      [Validators.required, Validators.min(-450), Validators.max(9000)],
    ],
    windHeightM: [this.station?.windHeightM ?? 2, [Validators.required, Validators.min(0.5), Validators.max(100)]],
    exposure: [this.station?.exposure ?? ('interior' as StationExposure)],
    sourceKind: [this.station?.sourceKind ?? ('upload' as StationSourceKind)],
  });

  protected async save(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    const input: WeatherStationInput = {
      ...v,
      name: v.name.trim(),
      latitude: Number(v.latitude),
      longitude: Number(v.longitude),
      elevationM: Number(v.elevationM),
      windHeightM: Number(v.windHeightM),
    };
    this.saving.set(true);
    try {
      this.ref.close(
        await firstValueFrom(this.station ? this.api.update(this.station.id, input) : this.api.create(input)),
      );
    } catch (err) {
      const problem = describeApiError(err, 'The station could not be saved.');
      this.saveError.set([problem.message, ...applyFieldErrors(this.form, problem.fields)].join(' '));
    } finally {
      this.saving.set(false);
    }
  }
}

export function editStation(
  dialog: MatDialog,
  station: WeatherStationDto | null,
): Promise<WeatherStationDto | undefined> {
  return firstValueFrom(
    dialog
      .open<StationForm, WeatherStationDto | null, WeatherStationDto>(StationForm, {
        data: station,
        width: '640px',
        maxWidth: '96vw',
      })
      .afterClosed(),
  );
}
