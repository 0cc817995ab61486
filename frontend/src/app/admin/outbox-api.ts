import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

/** One e-mail caught by the local development SMTP server. */
export interface OutboxMessage {
  id: string;
  from: string;
  to: string;
  subject: string;
  date: string;
  text: string;
  html: string;
}

/** The development outbox (administrators only). */
@Injectable({ providedIn: 'root' })
export class OutboxApi {
  private readonly http = inject(HttpClient);

  messages(): Observable<{ messages: OutboxMessage[] }> {
    return this.http.get<{ messages: OutboxMessage[] }>('/api/dev/outbox');
  }
}
