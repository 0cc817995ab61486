import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Page, SortDirection } from '@shared/api/page';
import type { Role } from '@shared/auth/roles';
import type { InviteInput, OrgUserDto, UserSort } from '@shared/users/user';
import { Observable } from 'rxjs';

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
    let params = new HttpParams()
      .set('page', query.page)
      .set('pageSize', query.pageSize)
      .set('sort', query.sort)
      .set('dir', query.dir);
    if (query.q) params = params.set('q', query.q);
    return this.http.get<Page<OrgUserDto>>('/api/users', { params });
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
