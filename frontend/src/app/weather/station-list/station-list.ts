import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { editStation } from '../station-form/station-form';
import { WeatherApi } from '../weather-api';

/** `/weather-stations`: the stations the organisation owns or whose sites it sees. */
@Component({
  selector: 'rm-station-list',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule],
  template: `
    <section class="rm-page">
      <header class="rm-page-header">
        <h1>Weather stations</h1>
        @if (canCreate()) {
          <button mat-flat-button type="button" (click)="create()"><mat-icon>add</mat-icon> New station</button>
        }
      </header>
      @if (error(); as message) {
        <div class="rm-state rm-state-error" role="alert">
          <mat-icon aria-hidden="true">error</mat-icon>
          <p>{{ message }}</p>
        </div>
      } @else {
        <div class="rm-table-scroll">
          <div class="rm-progress-slot">
            @if (stations.isLoading()) {
              <mat-progress-bar mode="indeterminate" aria-label="Loading stations" />
            }
          </div>
          <table
            mat-table
            [dataSource]="stations.hasValue() ? stations.value().items : []"
            aria-label="Weather stations"
          >
            <ng-container matColumnDef="name">
              <th mat-header-cell *matHeaderCellDef>Name</th>
              <td mat-cell *matCellDef="let s">
                <a [routerLink]="['/weather-stations', s.id]">{{ s.name }}</a>
              </td>
            </ng-container>
            <ng-container matColumnDef="owner">
              <th mat-header-cell *matHeaderCellDef>Owner</th>
              <td mat-cell *matCellDef="let s">{{ s.organisationName }}</td>
            </ng-container>
            <ng-container matColumnDef="source">
              <th mat-header-cell *matHeaderCellDef>Data from</th>
              <td mat-cell *matCellDef="let s">{{ s.sourceKind === 'feed' ? 'Weather feed' : 'Uploads' }}</td>
            </ng-container>
            <ng-container matColumnDef="days">
              <th mat-header-cell *matHeaderCellDef>Days stored</th>
              <td mat-cell *matCellDef="let s">{{ s.dayCount }}{{ s.lastDate ? ' (to ' + s.lastDate + ')' : '' }}</td>
            </ng-container>
            <tr mat-header-row *matHeaderRowDef="columns"></tr>
            <tr mat-row *matRowDef="let row; columns: columns"></tr>
            <tr class="mat-row" *matNoDataRow>
              <td class="mat-cell" [attr.colspan]="columns.length">No weather stations yet.</td>
            </tr>
          </table>
        </div>
      }
    </section>
  `,
  styles: `
    table {
      width: 100%;
    }
    td.mat-cell {
      padding: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationList {
  private readonly api = inject(WeatherApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly auth = inject(AuthStore);
  protected readonly columns = ['name', 'owner', 'source', 'days'];
  protected readonly stations = rxResource({ stream: () => this.api.list() });
  protected readonly canCreate = computed(() => this.auth.user()?.organisation.role !== 'auditor');
  protected readonly error = computed(() => {
    const err = this.stations.error();
    return err ? describeApiError(err, 'The stations could not be loaded.').message : null;
  });

  protected async create(): Promise<void> {
    const created = await editStation(this.dialog, null);
    if (created) await this.router.navigate(['/weather-stations', created.id]);
  }
}
