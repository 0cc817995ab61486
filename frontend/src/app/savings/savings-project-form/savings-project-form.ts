import { ChangeDetectionStrategy, Component, inject, input, output, signal, type OnInit } from '@angular/core';
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
        <input matInput type="date" name="installedOn" required [(ngModel)]="draft.installedOn" />
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
      @for (f of monthFields; track f.key) {
        <mat-form-field appearance="outline">
          <mat-label>{{ f.label }}</mat-label>
          <input matInput type="month" [name]="f.key" required [(ngModel)]="draft[f.key]" />
          @if (fieldErrors()[f.key]) {
            <mat-hint class="err">{{ fieldErrors()[f.key] }}</mat-hint>
          }
        </mat-form-field>
      }
      <mat-form-field appearance="outline" class="wide">
        <mat-label>Baseline model</mat-label>
        <mat-select name="modelForm" [(ngModel)]="draft.modelForm">
          @for (m of forms; track m) {
            <mat-option [value]="m">{{ modelLabels[m] }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
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
    { key: 'baselineFrom', label: 'Baseline from (month)' },
    { key: 'baselineTo', label: 'Baseline to (month)' },
    { key: 'reportingFrom', label: 'Reporting from (month)' },
    { key: 'reportingTo', label: 'Reporting to (month)' },
  ] as const;
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
      };
  }

  protected async save(): Promise<void> {
    this.saving.set(true);
    this.error.set(null);
    try {
      const p = this.project();
      this.saved.emit(
        await firstValueFrom(
          p ? this.api.updateProject(p.id, this.draft) : this.api.createProject(this.siteId(), this.draft),
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
