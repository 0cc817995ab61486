import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import type { SiteDto } from '@shared/sites/site';
import {
  DAY_MODES,
  DAY_MODE_LABELS,
  WEEKDAY_LABELS,
  addressNumberOf,
  daysText,
  hoursText,
  type WateringRuleDto,
  type WateringRuleInput,
} from '@shared/watering-rules/watering-rule';
import { firstValueFrom } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { SitesApi } from '../../sites/sites-api';
import { WateringRulesApi } from '../watering-rules-api';
import { blankRule, toInput } from './rule-form-model';

/** An agency's watering rules by stage: the list, and a form to add or change one and choose the sites under it. */
@Component({
  selector: 'rm-rules-page',
  host: { class: 'rm-page' },
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  templateUrl: './rules-page.html',
  styleUrls: ['../../shared/card-table.scss', './rules-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RulesPage {
  private readonly api = inject(WateringRulesApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly dialog = inject(MatDialog);

  protected readonly rules = rxResource({ stream: () => this.api.list() });
  protected readonly sites = rxResource({
    stream: () => this.sitesApi.list({ page: 0, pageSize: 200, sort: 'name', dir: 'asc', q: '', tag: '', kind: '' }),
  });
  protected readonly loadError = computed(() => {
    const error = this.rules.error() ?? this.sites.error();
    return error ? describeApiError(error, 'The rules could not be loaded.').message : null;
  });
  protected readonly dayModes = DAY_MODES;
  protected readonly dayModeLabels = DAY_MODE_LABELS;
  protected readonly weekdays = WEEKDAY_LABELS.map((label, value) => ({ label, value }));
  protected readonly hours = Array.from({ length: 24 }, (_, h) => h);
  protected readonly daysText = daysText;
  protected readonly hoursText = hoursText;

  /** The rule being edited (id null for a new one), or null when the form is closed. */
  protected readonly editing = signal<{ id: number | null; form: WateringRuleInput; siteIds: number[] } | null>(null);
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);

  protected add(): void {
    this.editing.set({ id: null, form: blankRule(), siteIds: [] });
    this.saveError.set(null);
  }

  protected edit(rule: WateringRuleDto): void {
    this.editing.set({ id: rule.id, form: toInput(rule), siteIds: rule.sites.map((s) => s.siteId) });
    this.saveError.set(null);
  }

  protected siteName(id: number): string {
    return this.siteList().find((s) => s.id === id)?.name ?? `Site ${id}`;
  }

  private siteList(): SiteDto[] {
    return this.sites.hasValue() ? this.sites.value().items : [];
  }

  /** Keeps each chosen site's assignment; a newly chosen one takes its address number from its address. */
  protected chooseSites(e: { form: WateringRuleInput; siteIds: number[] }, ids: number[]): void {
    const form = e.form;
    e.siteIds = ids;
    form.sites = ids.map(
      (id) =>
        form.sites.find((s) => s.siteId === id) ?? {
          siteId: id,
          addressNumber: addressNumberOf(this.siteList().find((s) => s.id === id)?.address ?? ''),
          assignedWeekdays: [],
        },
    );
  }

  protected toggle(days: number[], day: number, on: boolean): number[] {
    return on ? [...new Set([...days, day])].sort() : days.filter((d) => d !== day);
  }

  protected async save(): Promise<void> {
    const current = this.editing();
    if (!current) return;
    this.saving.set(true);
    this.saveError.set(null);
    try {
      const form = { ...current.form, inForceTo: current.form.inForceTo || null };
      await firstValueFrom(current.id === null ? this.api.create(form) : this.api.update(current.id, form));
      this.editing.set(null);
      this.rules.reload();
    } catch (err) {
      this.saveError.set(describeApiError(err, 'The rule could not be saved.').message);
    } finally {
      this.saving.set(false);
    }
  }

  protected async remove(rule: WateringRuleDto): Promise<void> {
    const ok = await confirm(this.dialog, {
      title: `Delete ${rule.name} (${rule.stage})?`,
      message: 'Its sites are no longer checked against it; alerts already raised stay.',
      confirmLabel: 'Delete',
    });
    if (!ok) return;
    await firstValueFrom(this.api.remove(rule.id));
    this.rules.reload();
  }
}
