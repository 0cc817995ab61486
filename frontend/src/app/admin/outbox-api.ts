import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { OutboxMessage } from '@shared/mail/outbox-message';

export type { OutboxMessage };

/** The development outbox (administrators only). */
@Injectable({ providedIn: 'root' })
export class OutboxApi {
  private readonly http = inject(HttpClient);

  messages(): Observable<{ messages: OutboxMessage[] }> {
    return this.http.get<{ messages: OutboxMessage[] }>('/api/dev/outbox');
  }
}
