import { BreakpointObserver } from '@angular/cdk/layout';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { rxResource, takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { DEFAULT_PAGE_SIZE, type Page, type SortDirection } from '@shared/api/page';
import { ROLE_LABELS, ROLES, type Role } from '@shared/auth/roles';
import { USER_SORTS, type OrgUserDto, type UserSort, type UserStatus } from '@shared/users/user';
import { debounceTime, distinctUntilChanged, firstValueFrom, map, type Observable } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { InviteDialog } from '../invite-dialog/invite-dialog';
import { UsersApi, type UserQuery } from '../users-api';

const STATUS_LABELS: Record<UserStatus, string> = { active: 'Active', invited: 'Invited', disabled: 'Disabled' };
const ALL_COLUMNS = ['displayName', 'email', 'role', 'status', 'lastSignInAt', 'actions'];
const PHONE_COLUMNS = ['displayName', 'role', 'actions'];

/** The people in the administrator's organisation: invite, change roles, disable, send reset links. */
@Component({
  selector: 'rm-user-list',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatTableModule,
    MatSortModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatMenuModule,
    MatButtonModule,
    MatIconModule,
  ],
  templateUrl: './user-list.html',
  styleUrl: './user-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UserList {
  private readonly api = inject(UsersApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly auth = inject(AuthStore);

  protected readonly roles = ROLES;
  // Table rows are untyped in templates, hence the string-keyed views of the label maps.
  protected readonly roleLabels: Record<string, string> = ROLE_LABELS;
  protected readonly statusLabels: Record<string, string> = STATUS_LABELS;
  protected readonly pageSizeOptions = [10, DEFAULT_PAGE_SIZE, 50, 100];
  protected readonly myId = computed(() => this.auth.user()?.id);

  protected readonly sort = signal<UserSort>('displayName');
  protected readonly dir = signal<SortDirection>('asc');
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(DEFAULT_PAGE_SIZE);
  protected readonly q = signal('');
  protected readonly search = new FormControl('', { nonNullable: true });

  private readonly query = computed<UserQuery>(() => ({
    page: this.pageIndex(),
    pageSize: this.pageSize(),
    sort: this.sort(),
    dir: this.dir(),
    q: this.q(),
  }));
  protected readonly users = rxResource({ params: () => this.query(), stream: ({ params }) => this.api.list(params) });
  private readonly shown = linkedSignal<Page<OrgUserDto> | undefined, Page<OrgUserDto> | undefined>({
    source: () => (this.users.hasValue() ? this.users.value() : undefined),
    computation: (page, previous) => page ?? previous?.value,
  });
  protected readonly rows = computed(() => this.shown()?.items ?? []);
  protected readonly total = computed(() => this.shown()?.total ?? 0);
  protected readonly errorMessage = computed(() => {
    const error = this.users.error();
    return error ? describeApiError(error, 'The users could not be loaded.').message : null;
  });
  /** Ids of rows with a change in flight, so their controls can't be used twice. */
  protected readonly busy = signal<ReadonlySet<number>>(new Set());

  private readonly phone = toSignal(
    inject(BreakpointObserver)
      .observe('(max-width: 720px)')
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  protected readonly columns = computed(() => (this.phone() ? PHONE_COLUMNS : ALL_COLUMNS));

  constructor() {
    this.search.valueChanges
      .pipe(
        map((text) => text.trim()),
        debounceTime(300),
        distinctUntilChanged(),
        takeUntilDestroyed(),
      )
      .subscribe((text) => {
        this.q.set(text);
        this.pageIndex.set(0);
      });
  }

  protected sortBy(event: Sort): void {
    const active = USER_SORTS.find((sort) => sort === event.active);
    this.sort.set(active && event.direction ? active : 'displayName');
    this.dir.set(active && event.direction ? event.direction : 'asc');
    this.pageIndex.set(0);
  }

  protected changePage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }

  protected retry(): void {
    this.users.reload();
  }

  protected async openInvitation(): Promise<void> {
    const ref = this.dialog.open<InviteDialog, void, OrgUserDto>(InviteDialog, { maxWidth: '94vw' });
    const invited = await firstValueFrom(ref.afterClosed());
    if (!invited) return;
    this.snackBar.open(`Invitation sent to ${invited.email}.`, undefined, { duration: 4000 });
    this.users.reload();
  }

  protected changeRole(user: OrgUserDto, role: Role): void {
    void this.apply(user, this.api.update(user.id, { role }), `${user.displayName} is now ${ROLE_LABELS[role]}.`);
  }

  protected async disable(user: OrgUserDto): Promise<void> {
    const confirmed = await confirm(this.dialog, {
      title: `Disable ${user.displayName}?`,
      message: 'They will be signed out and cannot sign in until an administrator enables them again.',
      confirmLabel: 'Disable',
      danger: true,
    });
    if (!confirmed) return;
    await this.apply(user, this.api.update(user.id, { status: 'disabled' }), `${user.displayName} is disabled.`);
  }

  protected enable(user: OrgUserDto): void {
    void this.apply(user, this.api.update(user.id, { status: 'active' }), `${user.displayName} is enabled.`);
  }

  protected sendPasswordReset(user: OrgUserDto): void {
    void this.apply(user, this.api.sendPasswordReset(user.id), `A password reset link was sent to ${user.email}.`);
  }

  /** Runs one row action, reports the outcome, and refreshes the page from the server. */
  private async apply(user: OrgUserDto, request: Observable<unknown>, success: string): Promise<void> {
    this.busy.update((ids) => new Set(ids).add(user.id));
    try {
      await firstValueFrom(request, { defaultValue: undefined });
      this.snackBar.open(success, undefined, { duration: 4000 });
    } catch (err) {
      this.snackBar.open(describeApiError(err, 'That change could not be made.').message, 'Dismiss');
    } finally {
      this.busy.update((ids) => {
        const next = new Set(ids);
        next.delete(user.id);
        return next;
      });
      this.users.reload();
    }
  }
}
