import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTableModule } from '@angular/material/table';
import type { RejectionDto, RejectionKind } from '@shared/uploads/upload';

const KIND_LABELS: Record<RejectionKind, string> = {
  rejected: 'Not imported',
  conflict: 'Differs from stored',
  notice: 'Note',
  unknown: 'Unknown meter',
};

/** Rows an upload could not take (and conflicts and notes), where they are and why; downloadable as CSV. */
@Component({
  selector: 'rm-rejection-table',
  imports: [MatTableModule, MatButtonModule, MatIconModule],
  templateUrl: './rejection-table.html',
  styleUrl: './rejection-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RejectionTable {
  readonly rejections = input.required<RejectionDto[]>();
  /** How many there are in all (the table may show the first ones only). */
  readonly total = input.required<number>();
  readonly csvUrl = input.required<string>();
  /** A paginator beside the table shows the rest (no "first N" note then). */
  readonly paged = input(false);

  protected readonly columns = ['row', 'column', 'kind', 'message'];
  protected kindLabel(kind: string): string {
    return KIND_LABELS[kind as RejectionKind] ?? kind;
  }
}
