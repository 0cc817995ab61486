import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page, SortDirection } from '@shared/api/page';
import type { Role } from '@shared/auth/roles';
import type { InviteInput, OrgUserDto, UserSort } from '@shared/users/user';
import { Observable } from 'rxjs';
import { queryParams } from '../core/http/query-params';

export interface UserQuery {
  page: number;
  pageSize: number;
  sort: UserSort;
  dir: SortDirection;
  q: string;
}

export interface UserChange {
  role?: Role;
  status?: 'active' | 'disabled';
}

/** The /api/users endpoints (administrators only). */
@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);

  list(query: UserQuery): Observable<Page<OrgUserDto>> {
    return this.http.get<Page<OrgUserDto>>('/api/users', { params: queryParams({ ...query }) });
  }

  invite(input: InviteInput): Observable<OrgUserDto> {
    return this.http.post<OrgUserDto>('/api/users/invitations', input);
  }

  update(id: number, change: UserChange): Observable<OrgUserDto> {
    return this.http.patch<OrgUserDto>(`/api/users/${id}`, change);
  }

  sendPasswordReset(id: number): Observable<void> {
    return this.http.post<void>(`/api/users/${id}/password-reset`, {});
  }
}
