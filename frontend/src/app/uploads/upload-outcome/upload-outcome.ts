import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, effect, inject, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import type { ConflictDayDto, ConflictSummaryDto, RejectionDto, RepeatChoice, UploadDto } from '@shared/uploads/upload';
import type { Observable } from 'rxjs';
import { RejectionTable } from '../rejection-table/rejection-table';
import { UploadsApi } from '../uploads-api';

const REPEAT_CHOICES: Array<{ choice: RepeatChoice; label: string }> = [
  { choice: 'keep-first', label: 'Keep the first row of each' },
  { choice: 'keep-last', label: 'Keep the last row of each' },
  { choice: 'sum', label: 'Add them up (the export split an interval)' },
];

/**
 * What one upload did: counts (per site when it touched several), its conflicts per day with "replace these"
 * actions after the fact, the choice for readings the file gave twice differently, and the paged list of rows
 * needing attention.
 */
@Component({
  selector: 'rm-upload-outcome',
  imports: [MatButtonModule, MatPaginatorModule, RejectionTable],
  templateUrl: './upload-outcome.html',
  styleUrl: './upload-outcome.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadOutcome {
  private readonly api = inject(UploadsApi);

  readonly upload = input.required<UploadDto>();
  /** Whether the viewer may change the upload's sites (replace, choose). */
  readonly canAct = input(false);
  /** The upload after an action changed it. */
  readonly changed = output<UploadDto>();

  protected readonly summary = signal<ConflictSummaryDto | null>(null);
  protected readonly rejections = signal<{ items: RejectionDto[]; total: number } | null>(null);
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = 50;
  protected readonly busy = signal(false);
  protected readonly message = signal<string | null>(null);
  protected readonly repeatChoices = REPEAT_CHOICES;

  constructor() {
    effect(() => {
      const id = this.upload().id;
      this.pageIndex.set(0);
      this.load(id);
    });
  }

  protected csvUrl(): string {
    return this.api.rejectionsCsvUrl(this.upload().id);
  }

  protected siteName(siteId: number): string {
    return this.upload().sites.find((s) => s.siteId === siteId)?.siteName ?? `site #${siteId}`;
  }

  protected storedDays(): ConflictDayDto[] {
    return (this.summary()?.days ?? []).filter((d) => d.kind === 'stored');
  }

  protected page(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
    this.api.rejections(this.upload().id, event.pageIndex, this.pageSize).subscribe((r) => this.rejections.set(r));
  }

  protected replace(day?: ConflictDayDto): void {
    const scope = day ? { siteId: day.siteId, date: day.date } : undefined;
    this.act(this.api.replaceConflicts(this.upload().id, scope), (r) => `${r.replaced} reading(s) replaced.`);
  }

  protected resolve(choice: RepeatChoice): void {
    this.act(this.api.resolveRepeats(this.upload().id, choice), (r) => `${r.stored} reading(s) stored.`);
  }

  private act<T extends { upload: UploadDto }>(call: Observable<T>, said: (r: T) => string): void {
    this.busy.set(true);
    call.subscribe({
      next: (r) => {
        this.busy.set(false);
        this.message.set(said(r));
        this.changed.emit(r.upload);
      },
      error: (e: HttpErrorResponse) => {
        this.busy.set(false);
        this.message.set(e.error?.error?.message ?? 'That did not work; nothing was changed.');
      },
    });
  }

  private load(id: number): void {
    this.api.rejections(id, 0, this.pageSize).subscribe((r) => this.rejections.set(r));
    this.api.conflicts(id).subscribe({
      next: (s) => this.summary.set(s),
      error: () => this.summary.set(null),
    });
  }
}
