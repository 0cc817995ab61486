import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { atLeast } from '@shared/auth/roles';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { SitesApi } from '../../sites/sites-api';
import { PlannerApi } from '../planner-api';

/** `/sites/:id/planner`: the site's what-if plans, and starting one. */
@Component({
  selector: 'rm-plan-list',
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
  ],
  template: `
    <section class="rm-page">
      <header class="rm-page-header">
        <h2>What-if planner</h2>
        @if (canWrite() && !starting()) {
          <button mat-flat-button type="button" (click)="starting.set(true)"><mat-icon>add</mat-icon> New plan</button>
        }
      </header>
      <p class="intro">
        Change the hydrozones on a copy — spray to drip, turf to low-water plants, area removed, a smart controller or a
        rain sensor — and see the new MWELO allowance, estimated use, money saved at the site's own rates and the simple
        payback.
      </p>
      @if (starting()) {
        <form class="new-plan" (ngSubmit)="create()" aria-label="New plan">
          @if (formError(); as message) {
            <div class="rm-form-error" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</div>
          }
          <div class="rm-form-grid">
            <mat-form-field class="wide">
              <mat-label>Title</mat-label>
              <input matInput name="title" [(ngModel)]="title" required maxlength="160" />
            </mat-form-field>
            <mat-form-field>
              <mat-label>Weather year</mat-label>
              <input matInput type="number" inputmode="numeric" name="year" [(ngModel)]="weatherYear" />
            </mat-form-field>
            <mat-form-field>
              <mat-label>Cost of the work (USD)</mat-label>
              <input matInput type="number" inputmode="decimal" name="cost" min="0" [(ngModel)]="costOfWork" />
            </mat-form-field>
          </div>
          <div class="actions">
            <button mat-flat-button type="submit" [disabled]="saving() || !title.trim()">Create plan</button>
            <button mat-button type="button" (click)="starting.set(false)">Cancel</button>
          </div>
        </form>
      }
      <div class="rm-progress-slot">
        @if (plans.isLoading()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading plans" />
        }
      </div>
      @if (error(); as message) {
        <div class="rm-state rm-state-error" role="alert">
          <mat-icon aria-hidden="true">error</mat-icon>
          <p>{{ message }}</p>
        </div>
      } @else if (plans.hasValue()) {
        <ul class="plans" aria-label="Plans">
          @for (p of plans.value().items; track p.id) {
            <li>
              <a class="title" [routerLink]="[p.id]">{{ p.title }}</a>
              <span class="meta">
                {{ p.status === 'carried-out' ? 'Carried out ' + p.carriedOutOn : 'Draft' }} ·
                {{ p.zoneChanges.length }} zones changed · weather {{ p.weatherYear }}
              </span>
            </li>
          } @empty {
            <li class="rm-state">
              <mat-icon aria-hidden="true">compare_arrows</mat-icon>
              <p>No plans for this site yet.</p>
            </li>
          }
        </ul>
      }
    </section>
  `,
  styles: `
    .intro {
      color: var(--mat-sys-on-surface-variant);
      max-width: 75ch;
    }
    .new-plan {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      padding: 16px;
      margin-bottom: 16px;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .plans {
      list-style: none;
      margin: 0;
      padding: 0;
      li:not(.rm-state) {
        display: flex;
        flex-direction: column;
        padding: 12px 0;
        border-bottom: 1px solid var(--mat-sys-outline-variant);
      }
      .title {
        font: var(--mat-sys-title-medium);
        overflow-wrap: anywhere;
      }
      .meta {
        color: var(--mat-sys-on-surface-variant);
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanList {
  private readonly api = inject(PlannerApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly router = inject(Router);

  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));
  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly plans = rxResource({ params: () => this.siteId(), stream: ({ params }) => this.api.list(params) });
  protected readonly canWrite = computed(() => this.site.hasValue() && atLeast(this.site.value().access, 'contribute'));
  protected readonly error = computed(() => {
    const err = this.plans.error();
    return err ? describeApiError(err, 'The plans could not be loaded.').message : null;
  });

  protected readonly starting = signal(false);
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected title = '';
  protected weatherYear = new Date().getUTCFullYear() - 1;
  protected costOfWork = 0;

  protected async create(): Promise<void> {
    this.saving.set(true);
    this.formError.set(null);
    try {
      const plan = await firstValueFrom(
        this.api.create(this.siteId(), {
          title: this.title,
          weatherYear: Number(this.weatherYear),
          costOfWork: Number(this.costOfWork) || 0,
          currency: 'USD',
          zoneChanges: [],
        }),
      );
      await this.router.navigate(['/sites', this.siteId(), 'planner', plan.id]);
    } catch (err) {
      this.formError.set(describeApiError(err, 'The plan could not be created.').message);
    } finally {
      this.saving.set(false);
    }
  }
}
