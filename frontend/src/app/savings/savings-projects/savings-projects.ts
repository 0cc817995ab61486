import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import {
  SAVINGS_CHANGE_LABELS,
  SAVINGS_PROJECT_STATUS_LABELS,
  type SavingsProjectDto,
} from '@shared/savings/savings-project-dto';
import { firstValueFrom, type Observable } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { SitesApi } from '../../sites/sites-api';
import { SavingsApi } from '../savings-api';
import { SavingsProjectForm } from '../savings-project-form/savings-project-form';

/**
 * `/reports/sites/:siteId/savings`: a site's savings projects. Creating needs contribute access; each project says
 * what the user may do with it (edit, mark installed, archive, delete), as the server decides.
 */
@Component({
  selector: 'rm-savings-projects',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, SavingsProjectForm],
  template: `
    <section class="rm-page">
      <header class="rm-page-header">
        <h1>Savings projects{{ site.hasValue() ? ' · ' + site.value().name : '' }}</h1>
        @if (canWrite() && editing() === null) {
          <button mat-flat-button type="button" (click)="editing.set('new')">
            <mat-icon>add</mat-icon> New project
          </button>
        }
      </header>
      @if (editing() === 'new') {
        <rm-savings-project-form [siteId]="siteId()" (saved)="done($event)" (cancelled)="editing.set(null)" />
      }
      <div class="rm-progress-slot">
        @if (projects.isLoading()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading projects" />
        }
      </div>
      @if (error(); as message) {
        <div class="rm-state rm-state-error" role="alert">
          <mat-icon aria-hidden="true">error</mat-icon>
          <p>{{ message }}</p>
        </div>
      } @else if (projects.hasValue()) {
        @for (p of projects.value(); track p.id) {
          <article class="project">
            @if (editing() === p.id) {
              <rm-savings-project-form
                [siteId]="siteId()"
                [project]="p"
                (saved)="done($event)"
                (cancelled)="editing.set(null)"
              />
            } @else {
              <h2>
                <a [routerLink]="['/reports/savings', p.id]">{{ p.title }}</a>
                <span class="chip" [class]="'chip status-' + p.status">{{ statusLabels[p.status] }}</span>
              </h2>
              <p>
                {{ labels[p.changeKind] }}, installed {{ p.installedOn }}. Baseline {{ p.baselineFrom }} to
                {{ p.baselineTo }}; reporting {{ p.reportingFrom }} to {{ p.reportingTo }}.
              </p>
              <p class="sub">
                Written by {{ p.createdByName ?? 'a former user'
                }}{{ p.createdByOrganisation ? ' (' + p.createdByOrganisation + ')' : '' }}.
                @if (p.status === 'installed') {
                  Baseline and model locked since {{ p.lockedAt?.slice(0, 10) }}; changes need the site owner's manager.
                }
              </p>
              @if (p.changeDescription) {
                <p class="sub">{{ p.changeDescription }}</p>
              }
              @if (p.retrofits.length) {
                <ul class="retrofits" aria-label="Retrofit list">
                  @for (line of p.retrofits; track $index) {
                    <li>{{ line }}</li>
                  }
                </ul>
              }
              <div class="actions">
                <a mat-stroked-button [routerLink]="['/reports/savings', p.id]"
                  ><mat-icon>insights</mat-icon> Savings report</a
                >
                @if (p.can.edit) {
                  <button mat-button type="button" (click)="editing.set(p.id)">Edit</button>
                }
                @if (p.can.markInstalled) {
                  <button mat-button type="button" (click)="markInstalled(p)">Mark installed</button>
                }
                @if (p.can.archive) {
                  <button mat-button type="button" (click)="setArchived(p, p.status !== 'archived')">
                    {{ p.status === 'archived' ? 'Restore' : 'Archive' }}
                  </button>
                }
                @if (p.can.remove) {
                  <button mat-button type="button" (click)="remove(p)">Delete</button>
                }
              </div>
            }
          </article>
        } @empty {
          <div class="rm-state">
            <mat-icon aria-hidden="true">eco</mat-icon>
            <p>No savings projects on this site yet.</p>
          </div>
        }
      }
    </section>
  `,
  styles: `
    .project {
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      padding: 12px 0;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .chip {
      display: inline-block;
      margin-left: 8px;
      padding: 2px 10px;
      border-radius: 12px;
      font: var(--mat-sys-label-medium);
      vertical-align: middle;
      background: var(--mat-sys-surface-container-high);
    }
    .status-installed {
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
    }
    .retrofits {
      margin: 4px 0 8px;
      padding-left: 20px;
    }
    .sub {
      color: var(--mat-sys-on-surface-variant);
    }
    h2 {
      margin: 0 0 4px;
      font-size: 1.1rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SavingsProjects {
  private readonly api = inject(SavingsApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);
  private readonly router = inject(Router);
  /** Bound from the route parameter. */
  readonly siteId = input.required<number, string>({ transform: Number });

  protected readonly labels = SAVINGS_CHANGE_LABELS;
  protected readonly statusLabels = SAVINGS_PROJECT_STATUS_LABELS;
  protected readonly editing = signal<number | 'new' | null>(null);
  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly projects = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.api.projects(params),
  });
  // The server decides; this only hides buttons a role cannot use (contribute or better).
  protected readonly canWrite = computed(
    () => this.site.hasValue() && ['contribute', 'edit', 'own'].includes(this.site.value().access ?? ''),
  );
  protected readonly error = computed(() => {
    const err = this.projects.error();
    return err ? describeApiError(err, 'The projects could not be loaded.').message : null;
  });

  protected async done(project: SavingsProjectDto): Promise<void> {
    this.editing.set(null);
    this.projects.reload();
    await this.router.navigate(['/reports/savings', project.id]);
  }

  protected async markInstalled(p: SavingsProjectDto): Promise<void> {
    const sure = await confirm(this.dialog, {
      title: 'Mark installed?',
      message:
        `The installation date, the baseline months and the model of "${p.title}" lock now. ` +
        "Changing them later needs the site owner's manager and a reason, kept in the project's history.",
      confirmLabel: 'Mark installed',
    });
    if (sure) await this.act(this.api.markInstalled(p.id), 'The project could not be marked installed.');
  }

  protected async setArchived(p: SavingsProjectDto, archived: boolean): Promise<void> {
    await this.act(this.api.setArchived(p.id, archived), 'The project could not be changed.');
  }

  private async act(request: Observable<unknown>, failure: string): Promise<void> {
    try {
      await firstValueFrom(request);
      this.projects.reload();
    } catch (err) {
      this.snack.open(describeApiError(err, failure).message, 'OK', { duration: 8000 });
    }
  }

  protected async remove(p: SavingsProjectDto): Promise<void> {
    if (
      !(await confirm(this.dialog, {
        title: 'Delete savings project?',
        message: `"${p.title}" and its settings are removed; the site's metered data stay.`,
        confirmLabel: 'Delete',
        danger: true,
      }))
    )
      return;
    try {
      await firstValueFrom(this.api.deleteProject(p.id));
      this.projects.reload();
    } catch (err) {
      this.snack.open(describeApiError(err, 'The project could not be deleted.').message, 'OK', { duration: 8000 });
    }
  }
}
