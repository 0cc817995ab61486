import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
  type OnInit,
} from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { BASELINE_MODEL_FORMS, type BaselineModelForm } from '@shared/savings/baseline-model';
import {
  SAVINGS_CHANGE_KINDS,
  SAVINGS_CHANGE_LABELS,
  type SavingsProjectDto,
  type SavingsProjectInput,
} from '@shared/savings/savings-project-dto';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { SavingsApi } from '../savings-api';

const MODEL_LABELS: Record<BaselineModelForm, string> = {
  eto: 'Monthly use against ETo',
  'eto-rain': 'Monthly use against ETo and rain',
  'eto-per-day': 'Daily average use against ETo (weighted by days)',
  'eto-rain-per-day': 'Daily average use against ETo and rain (weighted by days)',
};

/** Creates or edits a savings project; the server checks the periods and reports field errors. */
@Component({
  selector: 'rm-savings-project-form',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    <form class="grid" (ngSubmit)="save()">
      <mat-form-field appearance="outline" class="wide">
        <mat-label>Title</mat-label>
        <input matInput name="title" required maxlength="160" [(ngModel)]="draft.title" />
        @if (fieldErrors()['title']) {
          <mat-hint class="err">{{ fieldErrors()['title'] }}</mat-hint>
        }
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>What changed</mat-label>
        <mat-select name="changeKind" [(ngModel)]="draft.changeKind">
          @for (k of kinds; track k) {
            <mat-option [value]="k">{{ kindLabels[k] }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Installed on (site's local date)</mat-label>
        <input
          matInput
          type="date"
          name="installedOn"
          required
          [disabled]="lockedForMe()"
          [(ngModel)]="draft.installedOn"
        />
      </mat-form-field>
      <mat-form-field appearance="outline" class="wide">
        <mat-label>Description</mat-label>
        <textarea
          matInput
          name="changeDescription"
          rows="2"
          maxlength="2000"
          [(ngModel)]="draft.changeDescription"
        ></textarea>
      </mat-form-field>
      <mat-form-field appearance="outline" class="wide">
        <mat-label>Retrofit list (one item per line)</mat-label>
        <textarea matInput name="retrofits" rows="3" [(ngModel)]="retrofitText"></textarea>
        @if (fieldErrors()['retrofits']) {
          <mat-hint class="err">{{ fieldErrors()['retrofits'] }}</mat-hint>
        }
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Installed cost (for the payback)</mat-label>
        <input matInput type="number" min="0" step="0.01" name="installedCost" [(ngModel)]="draft.installedCost" />
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Currency</mat-label>
        <input matInput name="costCurrency" maxlength="3" [(ngModel)]="draft.costCurrency" />
        @if (fieldErrors()['costCurrency']) {
          <mat-hint class="err">{{ fieldErrors()['costCurrency'] }}</mat-hint>
        }
      </mat-form-field>
      @if (locked()) {
        <p class="wide lock" role="note">
          The installation date, baseline months and model are locked since the project was marked installed.
          @if (lockedForMe()) {
            Only the site owner's managers can change them.
          } @else {
            Say why they change; the reason is kept in the project's history.
          }
        </p>
      }
      @for (f of monthFields; track f.key) {
        <mat-form-field appearance="outline">
          <mat-label>{{ f.label }}</mat-label>
          <input
            matInput
            type="month"
            [name]="f.key"
            required
            [disabled]="f.locks && lockedForMe()"
            [(ngModel)]="draft[f.key]"
          />
          @if (fieldErrors()[f.key]) {
            <mat-hint class="err">{{ fieldErrors()[f.key] }}</mat-hint>
          }
        </mat-form-field>
      }
      <mat-form-field appearance="outline" class="wide">
        <mat-label>Baseline model</mat-label>
        <mat-select name="modelForm" [disabled]="lockedForMe()" [(ngModel)]="draft.modelForm">
          @for (m of forms; track m) {
            <mat-option [value]="m">{{ modelLabels[m] }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      @if (locked() && !lockedForMe()) {
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Reason for changing the locked baseline or model</mat-label>
          <input matInput name="reason" maxlength="500" [(ngModel)]="reason" />
          @if (fieldErrors()['reason']) {
            <mat-hint class="err">{{ fieldErrors()['reason'] }}</mat-hint>
          }
        </mat-form-field>
      }
      @if (error(); as message) {
        <p class="err wide" role="alert">{{ message }}</p>
      }
      <div class="wide actions">
        <button mat-button type="button" (click)="cancelled.emit()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving()">
          {{ project() ? 'Save changes' : 'Create project' }}
        </button>
      </div>
    </form>
  `,
  styles: `
    .grid {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(200px, 1fr));
      gap: 4px 12px;
    }
    .wide {
      grid-column: 1 / -1;
    }
    .actions {
      display: flex;
      justify-content: flex-end;
      gap: 8px;
    }
    .err {
      color: var(--mat-sys-error);
    }
    .lock {
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SavingsProjectForm implements OnInit {
  private readonly api = inject(SavingsApi);
  readonly siteId = input.required<number>();
  readonly project = input<SavingsProjectDto | null>(null);
  readonly saved = output<SavingsProjectDto>();
  readonly cancelled = output<void>();

  protected readonly kinds = SAVINGS_CHANGE_KINDS;
  protected readonly kindLabels = SAVINGS_CHANGE_LABELS;
  protected readonly forms = BASELINE_MODEL_FORMS;
  protected readonly modelLabels = MODEL_LABELS;
  protected readonly monthFields = [
    { key: 'baselineFrom', label: 'Baseline from (month)', locks: true },
    { key: 'baselineTo', label: 'Baseline to (month)', locks: true },
    { key: 'reportingFrom', label: 'Reporting from (month)', locks: false },
    { key: 'reportingTo', label: 'Reporting to (month)', locks: false },
  ] as const;
  /** Installed: the baseline is locked; only the owner's managers (changeBaseline) may still change it. */
  protected readonly locked = computed(() => this.project()?.status === 'installed');
  protected readonly lockedForMe = computed(() => this.locked() && !this.project()?.can.changeBaseline);
  protected retrofitText = '';
  protected reason = '';
  protected draft: SavingsProjectInput = {
    title: '',
    changeKind: 'spray-to-drip',
    changeDescription: '',
    installedOn: '',
    baselineFrom: '',
    baselineTo: '',
    reportingFrom: '',
    reportingTo: '',
    modelForm: 'eto',
    installedCost: null,
    costCurrency: 'USD',
  };
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly fieldErrors = signal<Record<string, string>>({});

  ngOnInit(): void {
    const p = this.project();
    if (p)
      this.draft = {
        title: p.title,
        changeKind: p.changeKind,
        changeDescription: p.changeDescription,
        installedOn: p.installedOn,
        baselineFrom: p.baselineFrom,
        baselineTo: p.baselineTo,
        reportingFrom: p.reportingFrom,
        reportingTo: p.reportingTo,
        modelForm: p.modelForm,
        installedCost: p.installedCost,
        costCurrency: p.costCurrency ?? 'USD',
      };
    this.retrofitText = (p?.retrofits ?? []).join('\n');
  }

  private reasonIfAny(): { reason?: string } {
    return this.locked() && this.reason.trim() ? { reason: this.reason.trim() } : {};
  }

  protected async save(): Promise<void> {
    this.saving.set(true);
    this.error.set(null);
    try {
      const p = this.project();
      const input: SavingsProjectInput = {
        ...this.draft,
        retrofits: this.retrofitText
          .split('\n')
          .map((line) => line.trim())
          .filter(Boolean),
        installedCost: this.draft.installedCost === undefined ? null : this.draft.installedCost,
        costCurrency: this.draft.costCurrency?.trim().toUpperCase() || null,
      };
      this.saved.emit(
        await firstValueFrom(
          p
            ? this.api.updateProject(p.id, { ...lockedOmitted(input, this.lockedForMe()), ...this.reasonIfAny() })
            : this.api.createProject(this.siteId(), input),
        ),
      );
    } catch (err) {
      const problem = describeApiError(err, 'The project could not be saved.');
      this.error.set(problem.message);
      this.fieldErrors.set(problem.fields);
    } finally {
      this.saving.set(false);
    }
  }
}

/** A contractor's edit of an installed project leaves the locked fields out rather than sending them unchanged. */
function lockedOmitted(input: SavingsProjectInput, locked: boolean): Partial<SavingsProjectInput> {
  if (!locked) return input;
  const { installedOn: _i, baselineFrom: _f, baselineTo: _t, modelForm: _m, ...rest } = input;
  return rest;
}
