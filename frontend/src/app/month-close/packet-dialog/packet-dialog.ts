import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatListModule } from '@angular/material/list';
import { firstValueFrom } from 'rxjs';

export interface PacketDialogData {
  monthLabel: string;
  sites: { siteId: number; siteName: string; tags: string[] }[];
}

export interface PacketChoice {
  title: string;
  siteIds: number[];
}

/** Chooses a board packet's title and sites (an HOA's sites are quickest picked by their tag). */
@Component({
  selector: 'rm-packet-dialog',
  imports: [
    FormsModule,
    MatDialogModule,
    MatButtonModule,
    MatChipsModule,
    MatFormFieldModule,
    MatInputModule,
    MatListModule,
  ],
  template: `
    <h2 mat-dialog-title>New board packet, {{ data.monthLabel }}</h2>
    <mat-dialog-content>
      <mat-form-field appearance="outline" class="full">
        <mat-label>Title on the cover</mat-label>
        <input matInput maxlength="160" required [ngModel]="title()" (ngModelChange)="title.set($event)" />
      </mat-form-field>
      @if (tags().length) {
        <p class="hint">Pick the sites of one association by tag, or tick them one by one.</p>
        <mat-chip-set aria-label="Pick sites by tag">
          @for (t of tags(); track t) {
            <mat-chip (click)="pickTag(t)" (keydown.enter)="pickTag(t)" role="button" tabindex="0">{{ t }}</mat-chip>
          }
        </mat-chip-set>
      }
      <mat-selection-list aria-label="Sites in the packet" (selectionChange)="syncSelection($event.source)">
        @for (s of data.sites; track s.siteId) {
          <mat-list-option togglePosition="before" [value]="s.siteId" [selected]="chosen().has(s.siteId)">
            {{ s.siteName }}
          </mat-list-option>
        }
      </mat-selection-list>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="null">Cancel</button>
      <button mat-flat-button type="button" [disabled]="!ready()" [mat-dialog-close]="choice()">
        Build packet ({{ chosen().size }} {{ chosen().size === 1 ? 'site' : 'sites' }})
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .full {
      width: 100%;
    }
    .hint {
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
    }
    mat-chip {
      cursor: pointer;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PacketDialog {
  protected readonly data = inject<PacketDialogData>(MAT_DIALOG_DATA);
  protected readonly title = signal(`Board packet, ${this.data.monthLabel}`);
  protected readonly chosen = signal(new Set(this.data.sites.map((s) => s.siteId)));
  protected readonly tags = computed(() => [...new Set(this.data.sites.flatMap((s) => s.tags))].sort());
  protected readonly ready = computed(() => this.title().trim().length > 0 && this.chosen().size > 0);
  protected readonly choice = computed<PacketChoice>(() => ({
    title: this.title().trim(),
    // In the table's order, which is the order the packet prints them.
    siteIds: this.data.sites.map((s) => s.siteId).filter((id) => this.chosen().has(id)),
  }));

  protected pickTag(tag: string): void {
    this.chosen.set(new Set(this.data.sites.filter((s) => s.tags.includes(tag)).map((s) => s.siteId)));
  }

  protected syncSelection(list: { selectedOptions: { selected: { value: number }[] } }): void {
    this.chosen.set(new Set(list.selectedOptions.selected.map((o) => o.value)));
  }
}

export async function askPacket(dialog: MatDialog, data: PacketDialogData): Promise<PacketChoice | null> {
  const ref = dialog.open<PacketDialog, PacketDialogData, PacketChoice | null>(PacketDialog, {
    data,
    width: '520px',
    maxWidth: '94vw',
  });
  return (await firstValueFrom(ref.afterClosed())) ?? null;
}
