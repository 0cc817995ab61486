import { BreakpointObserver } from '@angular/cdk/layout';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { atLeast } from '@shared/auth/roles';
import type { ApiKeyDto } from '@shared/uploads/upload';
import { firstValueFrom, map } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { LoadError } from '../../shared/load-error/load-error';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { SitesApi } from '../../sites/sites-api';
import { ApiKeyDialog, type ApiKeyDialogData, type KeySite } from '../api-key-dialog/api-key-dialog';
import { ApiKeysApi } from '../api-keys-api';

const ALL_COLUMNS = ['name', 'sites', 'createdAt', 'lastUsedAt', 'status', 'actions'];
const PHONE_COLUMNS = ['name', 'actions'];

/** The organisation's machine-upload keys: make one for chosen sites, see when each was last used, revoke. */
@Component({
  selector: 'rm-api-key-list',
  imports: [DatePipe, MatTableModule, MatButtonModule, MatIconModule, MatProgressBarModule, LoadError],
  templateUrl: './api-key-list.html',
  styleUrl: './api-key-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApiKeyList {
  private readonly api = inject(ApiKeysApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly keys = rxResource({ stream: () => this.api.list() });
  // Site names for the table and the choices for a new key; 200 is the API's largest page.
  private readonly siteList = rxResource({
    stream: () => this.sitesApi.list({ page: 0, pageSize: 200, sort: 'name', dir: 'asc', q: '', tag: '', kind: '' }),
  });
  private readonly siteNames = computed(
    () => new Map((this.siteList.hasValue() ? this.siteList.value().items : []).map((s) => [s.id, s.name])),
  );
  /** A key uploads with contributor rights, so only sites the organisation may contribute to are offered. */
  private readonly keySites = computed<KeySite[]>(() =>
    (this.siteList.hasValue() ? this.siteList.value().items : [])
      .filter((s) => atLeast(s.access, 'contribute'))
      .map((s) => ({ id: s.id, name: s.name })),
  );

  protected readonly rows = computed(() => (this.keys.hasValue() ? this.keys.value() : []));
  protected readonly errorMessage = computed(() =>
    this.keys.error() ? describeApiError(this.keys.error(), 'The API keys could not be loaded.').message : null,
  );
  protected readonly busy = signal<ReadonlySet<number>>(new Set());
  protected readonly phone = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 720px)')
      .pipe(map((s) => s.matches)),
    { initialValue: false },
  );
  protected readonly columns = computed(() => (this.phone() ? PHONE_COLUMNS : ALL_COLUMNS));

  protected siteLabel(key: ApiKeyDto): string {
    return key.siteIds.map((id) => this.siteNames().get(id) ?? `Site ${id}`).join(', ');
  }

  protected retry(): void {
    this.keys.reload();
    if (this.siteList.error()) this.siteList.reload();
  }

  protected async openNewKey(): Promise<void> {
    const ref = this.dialog.open<ApiKeyDialog, ApiKeyDialogData, ApiKeyDto>(ApiKeyDialog, {
      data: { sites: this.keySites() },
      maxWidth: '94vw',
      autoFocus: 'first-tabbable',
    });
    const created = await firstValueFrom(ref.afterClosed());
    if (created) this.keys.reload();
  }

  protected async revoke(key: ApiKeyDto): Promise<void> {
    const sure = await confirm(this.dialog, {
      title: `Revoke “${key.name}”?`,
      message:
        `Scripts using ${key.prefix}… will be refused from now on. This ` +
        'cannot be undone; make a new key if you need one again.',
      confirmLabel: 'Revoke key',
      danger: true,
    });
    if (!sure) return;
    this.busy.update((ids) => new Set(ids).add(key.id));
    try {
      await firstValueFrom(this.api.revoke(key.id));
      this.snackBar.open(`“${key.name}” is revoked.`, undefined, { duration: 4000 });
      this.keys.reload();
    } catch (err) {
      this.snackBar.open(describeApiError(err, 'The key could not be revoked.').message, 'Close');
    } finally {
      this.busy.update((ids) => new Set([...ids].filter((id) => id !== key.id)));
    }
  }
}
