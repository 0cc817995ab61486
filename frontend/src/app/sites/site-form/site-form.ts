import { COMMA, ENTER } from '@angular/cdk/keycodes';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatChipInputEvent, MatChipsModule } from '@angular/material/chips';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Title } from '@angular/platform-browser';
import { Router, RouterLink } from '@angular/router';
import { atLeast } from '@shared/auth/roles';
import {
  SITE_KIND_LABELS,
  SITE_KINDS,
  SITE_LIMITS,
  type SiteDto,
  type SiteInput,
  type SiteKind,
} from '@shared/sites/site';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { SitesApi } from '../sites-api';
import { SiteSummary } from '../site-summary/site-summary';
import { TIME_ZONES, tagsValidator, timeZoneValidator } from './site-validators';

const TAG_SEPARATORS = [ENTER, COMMA];

/** Creates a site (`/sites/new`) or shows and edits one (`/sites/:id`), as far as the user's access allows. */
@Component({
  selector: 'rm-site-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatAutocompleteModule,
    MatChipsModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    SiteSummary,
  ],
  templateUrl: './site-form.html',
  styleUrl: './site-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteForm {
  private readonly api = inject(SitesApi);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly title = inject(Title);

  /** Route parameter; absent on `/sites/new`. */
  readonly id = input<string>();

  protected readonly limits = SITE_LIMITS;
  protected readonly kinds = SITE_KINDS;
  protected readonly kindLabels = SITE_KIND_LABELS;
  protected readonly tagSeparators = TAG_SEPARATORS;

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(SITE_LIMITS.nameMax)]],
    kind: ['' as SiteKind | '', Validators.required],
    address: ['', [Validators.required, Validators.maxLength(SITE_LIMITS.addressMax)]],
    timeZone: [Intl.DateTimeFormat().resolvedOptions().timeZone, [Validators.required, timeZoneValidator]],
    notes: ['', Validators.maxLength(SITE_LIMITS.notesMax)],
    tags: [[] as string[], tagsValidator],
  });

  protected readonly siteId = computed(() => {
    const id = Number(this.id());
    return Number.isInteger(id) && id > 0 ? id : undefined;
  });
  protected readonly creating = computed(() => this.id() === undefined);
  protected readonly site = rxResource({ params: () => this.siteId(), stream: ({ params }) => this.api.get(params) });
  protected readonly loaded = computed<SiteDto | undefined>(() =>
    this.site.hasValue() ? this.site.value() : undefined,
  );
  protected readonly loadError = computed(() => {
    if (!this.creating() && this.siteId() === undefined) return 'There is no site at this address.';
    const error = this.site.error();
    return error ? describeApiError(error, 'The site could not be loaded.').message : null;
  });
  protected readonly canEdit = computed(() => this.creating() || atLeast(this.loaded()?.access ?? 'read', 'edit'));
  protected readonly canDelete = computed(() => atLeast(this.loaded()?.access ?? 'read', 'own'));

  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);

  private readonly zoneText = toSignal(this.form.controls.timeZone.valueChanges, { initialValue: '' });
  protected readonly zoneOptions = computed(() => {
    const text = this.zoneText().toLowerCase().replace(/\s+/g, '_');
    return (text ? TIME_ZONES.filter((zone) => zone.toLowerCase().includes(text)) : TIME_ZONES).slice(0, 50);
  });

  constructor() {
    // Fill the form whenever a (re)loaded site arrives.
    effect(() => {
      const site = this.loaded();
      if (!site) return;
      this.title.setTitle(`${site.name} · Rillmark`);
      this.form.reset({
        name: site.name,
        kind: site.kind,
        address: site.address,
        timeZone: site.timeZone,
        notes: site.notes,
        tags: site.tags,
      });
    });
  }

  protected addTag(event: MatChipInputEvent): void {
    const tag = event.value.trim().toLowerCase();
    const tags = this.form.controls.tags;
    if (tag && !tags.value.includes(tag)) {
      tags.setValue([...tags.value, tag]);
      tags.markAsDirty();
    }
    event.chipInput.clear();
  }

  protected removeTag(tag: string): void {
    const tags = this.form.controls.tags;
    tags.setValue(tags.value.filter((t) => t !== tag));
    tags.markAsDirty();
  }

  protected async save(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const input: SiteInput = {
      ...value,
      kind: value.kind as SiteKind,
      name: value.name.trim(),
      address: value.address.trim(),
    };
    const existing = this.loaded();
    this.saving.set(true);
    this.saveError.set(null);
    try {
      if (existing) {
        const saved = await firstValueFrom(this.api.update(existing.id, input));
        this.site.set(saved);
        this.snackBar.open('Site saved.', undefined, { duration: 3000 });
      } else {
        const created = await firstValueFrom(this.api.create(input));
        this.snackBar.open(`“${created.name}” created.`, undefined, { duration: 3000 });
        await this.router.navigate(['/sites', created.id], { replaceUrl: true });
      }
    } catch (err) {
      const problem = describeApiError(err, 'The site could not be saved.');
      const unmatched = applyFieldErrors(this.form, problem.fields);
      this.saveError.set([problem.message, ...unmatched].join(' '));
    } finally {
      this.saving.set(false);
    }
  }

  protected async deleteSite(): Promise<void> {
    const site = this.loaded();
    if (!site) return;
    const confirmed = await confirm(this.dialog, {
      title: 'Delete this site?',
      message:
        `“${site.name}” and everything recorded for it will be removed ` +
        'for every organisation it is shared with. This cannot be undone.',
      confirmLabel: 'Delete site',
      danger: true,
    });
    if (!confirmed) return;
    this.saving.set(true);
    try {
      await firstValueFrom(this.api.remove(site.id));
      this.snackBar.open(`“${site.name}” deleted.`, undefined, { duration: 3000 });
      await this.router.navigate(['/sites']);
    } catch (err) {
      this.saveError.set(describeApiError(err, 'The site could not be deleted.').message);
    } finally {
      this.saving.set(false);
    }
  }

  protected retry(): void {
    this.site.reload();
  }
}
