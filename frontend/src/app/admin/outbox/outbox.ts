import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { DomSanitizer, type SafeHtml } from '@angular/platform-browser';
import { map } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { OutboxApi, type OutboxMessage } from '../outbox-api';

const URL_IN_TEXT = /https?:\/\/[^\s<>"')]+/g;
const APP_PATHS = ['/accept-invite', '/reset-password'];

/** Mail caught by the local fake SMTP server, so invitations and reset links can be followed in development. */
@Component({
  selector: 'rm-outbox',
  imports: [DatePipe, MatExpansionModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './outbox.html',
  styleUrl: './outbox.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Outbox {
  private readonly api = inject(OutboxApi);
  private readonly sanitizer = inject(DomSanitizer);

  protected readonly outbox = rxResource({ stream: () => this.api.messages().pipe(map((body) => body.messages)) });
  protected readonly messages = computed(() => (this.outbox.hasValue() ? this.outbox.value() : []));
  protected readonly errorMessage = computed(() => {
    const error = this.outbox.error();
    return error ? describeApiError(error, 'The outbox could not be loaded.').message : null;
  });
  /** Messages whose HTML version is shown instead of the text. */
  protected readonly showingHtml = signal<ReadonlySet<string>>(new Set());

  protected refresh(): void {
    this.outbox.reload();
  }

  protected toggleHtml(message: OutboxMessage): void {
    this.showingHtml.update((ids) => {
      const next = new Set(ids);
      if (!next.delete(message.id)) next.add(message.id);
      return next;
    });
  }

  /**
   * Links found in the text body. Links to this app's own pages (invitation, password reset) open here, on
   * whatever host and port the app is served from, since the mail carries the server's public address.
   */
  protected linksIn(message: OutboxMessage): { text: string; href: string }[] {
    return [...new Set(message.text.match(URL_IN_TEXT) ?? [])].map((text) => {
      const url = new URL(text);
      const own = APP_PATHS.some((path) => url.pathname === path);
      return { text, href: own ? url.pathname + url.search : text };
    });
  }

  /**
   * Trusted only because the iframe has an empty `sandbox`: no scripts, no forms, a unique origin. Angular's
   * sanitiser would otherwise strip the mail's inline styles.
   */
  protected htmlOf(message: OutboxMessage): SafeHtml {
    return this.sanitizer.bypassSecurityTrustHtml(message.html ?? '');
  }
}
