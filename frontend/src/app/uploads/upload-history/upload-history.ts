import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatTableModule } from '@angular/material/table';
import type { UploadKind } from '@shared/ingest/upload-kind';
import type { UploadDto, UploadStatus } from '@shared/uploads/upload';
import { KIND_LABELS } from '../column-mapping-editor/column-mapping-editor';

const STATUS_LABELS: Record<UploadStatus, string> = {
  processing: 'Reading…',
  done: 'Imported',
  failed: 'Refused',
  'rolled-back': 'Rolled back',
};

/** Earlier uploads of a site with their counts; a finished one can be rolled back. */
@Component({
  selector: 'rm-upload-history',
  imports: [MatTableModule, MatButtonModule, DatePipe, DecimalPipe],
  templateUrl: './upload-history.html',
  styleUrl: './upload-history.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadHistory {
  readonly uploads = input.required<UploadDto[]>();
  readonly timeZone = input.required<string>();
  readonly canRollBack = input(false);
  readonly rollBack = output<UploadDto>();
  readonly show = output<UploadDto>();

  protected readonly columns = ['id', 'file', 'when', 'status', 'counts', 'actions'];
  protected statusLabel(status: string): string {
    return STATUS_LABELS[status as UploadStatus] ?? status;
  }

  protected kindLabel(kind: string): string {
    return KIND_LABELS[kind as UploadKind] ?? kind;
  }
}
