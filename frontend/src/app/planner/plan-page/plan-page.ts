import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import type { PlanDto, ZoneChange } from '@shared/planner/plan-dto';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { HydrozonesApi } from '../../hydrozones/hydrozones-api';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { CarryOutDialog } from '../carry-out-dialog/carry-out-dialog';
import { PlanComparisonView } from '../plan-comparison-view/plan-comparison-view';
import { PlannerApi } from '../planner-api';
import { ZoneChangeEditor } from '../zone-change-editor/zone-change-editor';

/** `/sites/:id/planner/:planId`: change zones on the plan's copy, compare with today, hand a PDF to the board. */
@Component({
  selector: 'rm-plan-page',
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    PlanComparisonView,
    ZoneChangeEditor,
  ],
  templateUrl: './plan-page.html',
  styleUrl: './plan-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanPage {
  private readonly api = inject(PlannerApi);
  private readonly zonesApi = inject(HydrozonesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);
  private readonly router = inject(Router);

  readonly id = input.required<string>();
  readonly planId = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));
  private readonly planNumber = computed(() => Number(this.planId()));

  protected readonly plan = rxResource({
    params: () => this.planNumber(),
    stream: ({ params }) => this.api.get(params),
  });
  protected readonly comparison = rxResource({
    params: () => this.planNumber(),
    stream: ({ params }) => this.api.comparison(params),
  });
  protected readonly zones = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.zonesApi.list(params),
  });

  /** The copy being edited: starts from the saved plan, replaced whenever it is reloaded. */
  protected readonly draft = linkedSignal<PlanDto | undefined, PlanDto | null>({
    source: () => (this.plan.hasValue() ? this.plan.value() : undefined),
    computation: (p) => (p ? structuredClone(p) : null),
  });
  protected readonly dirty = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly pdfUrl = computed(() => this.api.pdfUrl(this.planNumber()));
  protected readonly loadError = computed(() => {
    const err = this.plan.error();
    return err ? describeApiError(err, 'The plan could not be loaded.').message : null;
  });
  protected readonly comparisonError = computed(() => {
    const err = this.comparison.error();
    return err ? describeApiError(err, 'The comparison could not be worked out.').message : null;
  });

  protected changeOf(zoneId: number): ZoneChange | undefined {
    return this.draft()?.zoneChanges.find((c) => c.hydrozoneId === zoneId);
  }

  protected setChange(event: ZoneChange | { hydrozoneId: number; remove: true }): void {
    this.draft.update((d) => {
      if (!d) return d;
      const others = d.zoneChanges.filter((c) => c.hydrozoneId !== event.hydrozoneId);
      return { ...d, zoneChanges: 'remove' in event ? others : [...others, event] };
    });
    this.dirty.set(true);
  }

  protected setField<K extends 'costOfWork' | 'weatherYear' | 'smartControllerReductionPercent' | 'rainSensor'>(
    key: K,
    value: PlanDto[K],
  ): void {
    this.draft.update((d) => (d ? { ...d, [key]: value } : d));
    this.dirty.set(true);
  }

  protected async save(): Promise<void> {
    const d = this.draft();
    if (!d) return;
    this.busy.set(true);
    this.problem.set(null);
    try {
      await firstValueFrom(
        this.api.update(d.id, {
          zoneChanges: d.zoneChanges,
          costOfWork: Number(d.costOfWork) || 0,
          weatherYear: Number(d.weatherYear),
          smartControllerReductionPercent:
            d.smartControllerReductionPercent === null ? null : Number(d.smartControllerReductionPercent),
          rainSensor: d.rainSensor,
        }),
      );
      this.dirty.set(false);
      this.plan.reload();
      this.comparison.reload();
    } catch (err) {
      this.problem.set(describeApiError(err, 'The plan could not be saved.').message);
    } finally {
      this.busy.set(false);
    }
  }

  protected async carryOut(): Promise<void> {
    const d = this.draft();
    if (!d) return;
    const today = new Date().toISOString().slice(0, 10);
    const installedOn = await firstValueFrom(
      this.dialog
        .open<CarryOutDialog, { title: string; today: string }, string | null>(CarryOutDialog, {
          data: { title: d.title, today },
        })
        .afterClosed(),
    );
    if (!installedOn) return;
    try {
      const { project } = await firstValueFrom(this.api.carryOut(d.id, { installedOn }));
      this.plan.reload();
      const ref = this.snack.open('Savings project created.', 'Open report', { duration: 8000 });
      ref.onAction().subscribe(() => void this.router.navigate(['/reports/savings', project.id]));
    } catch (err) {
      this.snack.open(describeApiError(err, 'The plan could not be carried out.').message, 'Close');
    }
  }

  protected async remove(): Promise<void> {
    const d = this.draft();
    if (!d) return;
    const ok = await confirm(this.dialog, {
      title: 'Delete plan?',
      message: `"${d.title}" is removed; the site's hydrozones are not touched.`,
      confirmLabel: 'Delete',
      danger: true,
    });
    if (!ok) return;
    await firstValueFrom(this.api.remove(d.id));
    await this.router.navigate(['/sites', this.siteId(), 'planner']);
  }
}
