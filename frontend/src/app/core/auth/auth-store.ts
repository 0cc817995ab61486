import { HttpErrorResponse } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { ROLE_LABELS, type Capabilities } from '@shared/auth/roles';
import type { CurrentUserDto } from '@shared/users/user';
import { firstValueFrom } from 'rxjs';
import { AuthApi } from './auth-api';

const NO_CAPABILITIES: Capabilities = {
  createSites: false,
  manageUsers: false,
  manageSettings: false,
  viewOutbox: false,
};

/** The signed-in user for the whole app; the single source the guards, shell and pages read. */
@Injectable({ providedIn: 'root' })
export class AuthStore {
  private readonly api = inject(AuthApi);
  private readonly current = signal<CurrentUserDto | null>(null);
  /** Shared by concurrent guards so `me` is fetched once per page load. */
  private loading: Promise<CurrentUserDto | null> | null = null;

  readonly user = this.current.asReadonly();
  readonly signedIn = computed(() => this.current() !== null);
  readonly capabilities = computed(() => this.current()?.capabilities ?? NO_CAPABILITIES);
  readonly roleLabel = computed(() => {
    const user = this.current();
    return user ? ROLE_LABELS[user.organisation.role] : '';
  });

  /** Resolves the session once; a 401 simply means "nobody signed in". Other failures propagate. */
  ensureLoaded(): Promise<CurrentUserDto | null> {
    this.loading ??= firstValueFrom(this.api.me()).then(
      (user) => {
        this.current.set(user);
        return user;
      },
      (err: unknown) => {
        if (err instanceof HttpErrorResponse && err.status === 401) {
          this.current.set(null);
          return null;
        }
        // Server unreachable or failing: ask again next time rather than caching the failure.
        this.loading = null;
        throw err;
      },
    );
    return this.loading;
  }

  async signIn(email: string, password: string): Promise<CurrentUserDto> {
    const user = await firstValueFrom(this.api.signIn(email, password));
    this.adopt(user);
    return user;
  }

  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.api.signOut());
    } finally {
      // Forget the user even if the server is unreachable: the next request will tell.
      this.forget();
    }
  }

  /** Takes a user the server just signed in (sign-in, accepted invitation). */
  adopt(user: CurrentUserDto): void {
    this.current.set(user);
    this.loading = Promise.resolve(user);
  }

  /** Called when the server says the session is gone. */
  forget(): void {
    this.current.set(null);
    this.loading = Promise.resolve(null);
  }
}
