import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { BoardPacketDto } from '@shared/month-close/month-close-dto';
import { MonthCloseApi } from '../month-close-api';

/** How often a building packet's stored progress is read again. */
const POLL_MS = 1000;

/** The month's board packets: a progress bar while one builds, a download link when done. */
@Component({
  selector: 'rm-board-packets',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    @if (packets.hasValue() && packets.value().items.length) {
      <ul class="packets" aria-label="Board packets">
        @for (p of packets.value().items; track p.id) {
          <li>
            <div class="head">
              <strong>{{ p.title }}</strong>
              <span class="sub">{{ p.totalSites }} sites · asked for by {{ p.createdBy }}</span>
            </div>
            @switch (p.status) {
              @case ('done') {
                <a mat-stroked-button [href]="fileUrl(p)" download
                  ><mat-icon>picture_as_pdf</mat-icon> Download PDF ({{ kb(p) }} kB)</a
                >
              }
              @case ('failed') {
                <span class="failed" role="alert">{{ p.error || 'The packet could not be built.' }}</span>
              }
              @default {
                <div class="building">
                  <mat-progress-bar
                    mode="determinate"
                    [value]="p.progress * 100"
                    [attr.aria-label]="'Building ' + p.title"
                  />
                  <span class="sub" aria-live="polite">{{ p.doneSites }} of {{ p.totalSites }} sites done</span>
                </div>
              }
            }
          </li>
        }
      </ul>
    } @else if (packets.hasValue()) {
      <p class="sub">No board packet for this month yet.</p>
    }
  `,
  styles: `
    .packets {
      list-style: none;
      margin: 0;
      padding: 0;
    }
    li {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px 16px;
      padding: 10px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .head {
      display: flex;
      flex-direction: column;
      min-width: 0;
    }
    .building {
      flex: 1 1 200px;
      max-width: 320px;
    }
    .sub {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .failed {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BoardPackets {
  private readonly api = inject(MonthCloseApi);
  readonly month = input.required<string>();
  /** Bumped by the page after it starts a packet, so the list shows it at once. */
  readonly version = input(0);

  protected readonly packets = rxResource({
    params: () => ({ month: this.month(), version: this.version() }),
    stream: ({ params }) => this.api.packets(params.month),
  });
  private readonly building = computed(
    () =>
      this.packets.hasValue() &&
      this.packets.value().items.some((p) => p.status === 'queued' || p.status === 'running'),
  );

  constructor() {
    let timer: ReturnType<typeof setTimeout> | undefined;
    effect(() => {
      clearTimeout(timer);
      if (this.building() && !this.packets.isLoading()) timer = setTimeout(() => this.packets.reload(), POLL_MS);
    });
    inject(DestroyRef).onDestroy(() => clearTimeout(timer));
  }

  protected fileUrl(p: BoardPacketDto): string {
    return this.api.packetFileUrl(p.id);
  }

  protected kb(p: BoardPacketDto): string {
    return Math.max(1, Math.round((p.sizeBytes ?? 0) / 1024)).toLocaleString('en-US');
  }
}
