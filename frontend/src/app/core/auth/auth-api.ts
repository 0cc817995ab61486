import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { CurrentUserDto } from '@shared/users/user';
import { Observable } from 'rxjs';

/** What a one-time e-mail link (invitation or password reset) is for. */
export interface TokenInfo {
  email: string;
  displayName: string;
  purpose: 'invite' | 'reset';
}

/** The /api/auth endpoints: session, CSRF token and one-time e-mail links. */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  csrf(): Observable<{ token: string }> {
    return this.http.get<{ token: string }>('/api/auth/csrf');
  }

  me(): Observable<CurrentUserDto> {
    return this.http.get<CurrentUserDto>('/api/auth/me');
  }

  signIn(email: string, password: string): Observable<CurrentUserDto> {
    return this.http.post<CurrentUserDto>('/api/auth/sign-in', { email, password });
  }

  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/sign-out', {});
  }

  token(token: string): Observable<TokenInfo> {
    return this.http.get<TokenInfo>(`/api/auth/tokens/${encodeURIComponent(token)}`);
  }

  acceptInvite(token: string, password: string): Observable<CurrentUserDto> {
    return this.http.post<CurrentUserDto>('/api/auth/accept-invite', { token, password });
  }

  resetPassword(token: string, password: string): Observable<void> {
    return this.http.post<void>('/api/auth/reset-password', { token, password });
  }
}
