import { Clipboard } from '@angular/cdk/clipboard';
import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { ApiKeyDto, NewApiKeyDto } from '@shared/uploads/upload';
import { firstValueFrom } from 'rxjs';
import { applyFieldErrors, describeApiError } from '../../core/http/api-error';
import { ApiKeysApi } from '../api-keys-api';

export interface KeySite {
  id: number;
  name: string;
}

export interface ApiKeyDialogData {
  /** Sites the administrator may hand to a key (contribute or better). */
  sites: KeySite[];
}

/**
 * Makes an API key in two steps: name and sites, then the secret, shown this once with a ready-made
 * nightly upload command. The secret lives only in this dialog; closing it forgets the secret.
 */
@Component({
  selector: 'rm-api-key-dialog',
  imports: [
    ReactiveFormsModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
  ],
  templateUrl: './api-key-dialog.html',
  styleUrl: './api-key-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApiKeyDialog {
  private readonly api = inject(ApiKeysApi);
  private readonly ref = inject<MatDialogRef<ApiKeyDialog, ApiKeyDto>>(MatDialogRef);
  private readonly clipboard = inject(Clipboard);
  private readonly origin = inject(DOCUMENT).location.origin;
  protected readonly sites = inject<ApiKeyDialogData>(MAT_DIALOG_DATA).sites;

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(120)]],
    siteIds: [[] as number[], Validators.required],
  });
  protected readonly creating = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly created = signal<NewApiKeyDto | null>(null);
  protected readonly copied = signal<'secret' | 'command' | null>(null);

  /** A nightly upload for the key's first site; the key itself stays in an environment variable, out of crontabs. */
  protected readonly command = computed(() => {
    const key = this.created();
    if (!key) return '';
    return [
      `curl --fail -H "Authorization: Bearer $RILLMARK_API_KEY" \\`,
      `  -F file=@readings.csv \\`,
      `  ${this.origin}/api/sites/${key.siteIds[0]}/uploads`,
    ].join('\n');
  });
  protected readonly otherSites = computed(() => {
    const key = this.created();
    return key ? this.sites.filter((s) => key.siteIds.slice(1).includes(s.id)) : [];
  });
  protected readonly firstSite = computed(() => this.sites.find((s) => s.id === this.created()?.siteIds[0]) ?? null);

  protected async createKey(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, siteIds } = this.form.getRawValue();
    this.creating.set(true);
    this.error.set(null);
    try {
      const key = await firstValueFrom(this.api.create(name.trim(), siteIds));
      this.created.set(key);
      // From here on a stray click or Escape must not throw the only copy of the secret away.
      this.ref.disableClose = true;
    } catch (err) {
      const problem = describeApiError(err, 'The API key could not be created.');
      this.error.set([problem.message, ...applyFieldErrors(this.form, problem.fields)].join(' '));
    } finally {
      this.creating.set(false);
    }
  }

  protected copy(what: 'secret' | 'command'): void {
    const text = what === 'secret' ? this.created()?.secret : this.command();
    if (text && this.clipboard.copy(text)) this.copied.set(what);
  }

  protected finish(): void {
    const key = this.created();
    if (!key) return;
    const { secret: _secret, ...stored } = key;
    this.ref.close(stored);
  }
}
