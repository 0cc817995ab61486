import { ChangeDetectionStrategy, Component, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import {
  FAULT_KINDS,
  FAULT_LABELS,
  FIELD_AUDIT_LIMITS,
  PHOTO_TYPES,
  type FaultDto,
  type FaultInput,
  type FaultKind,
  type ZoneTestDto,
} from '@shared/field-audits/field-audit-dto';

export interface PhotoPick {
  faultId: number;
  file: File;
}

/** Faults found on the audit with their photos; editors add faults and take photos with the phone's camera. */
@Component({
  selector: 'rm-fault-list',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  templateUrl: './fault-list.html',
  styleUrl: './fault-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FaultList {
  readonly faults = input.required<FaultDto[]>();
  readonly tests = input.required<ZoneTestDto[]>();
  readonly canEdit = input(false);
  readonly busy = input(false);
  readonly addFault = output<FaultInput>();
  readonly updateFault = output<{ id: number; input: FaultInput }>();
  readonly removeFault = output<FaultDto>();
  readonly addPhoto = output<PhotoPick>();
  readonly removePhoto = output<string>();

  protected readonly kinds = FAULT_KINDS;
  protected readonly labels = FAULT_LABELS;
  protected readonly accept = PHOTO_TYPES.join(',');
  protected readonly maxMb = FIELD_AUDIT_LIMITS.photoMaxBytes / 1024 / 1024;
  protected readonly adding = signal(false);
  protected kind: FaultKind = 'tilted-head';
  protected location = '';
  protected description = '';
  protected zoneTestId: number | null = null;

  protected submit(): void {
    this.addFault.emit({
      kind: this.kind,
      location: this.location,
      description: this.description,
      zoneTestId: this.zoneTestId,
    });
    this.location = '';
    this.description = '';
    this.adding.set(false);
  }

  protected toggle(f: FaultDto): void {
    this.updateFault.emit({
      id: f.id,
      input: {
        kind: f.kind,
        location: f.location,
        description: f.description,
        zoneTestId: f.zoneTestId,
        status: f.status === 'open' ? 'fixed' : 'open',
      },
    });
  }

  protected pick(faultId: number, event: Event): void {
    const target = event.target as HTMLInputElement;
    const file = target.files?.[0];
    if (file) this.addPhoto.emit({ faultId, file });
    target.value = '';
  }

  protected zoneName(id: number | null): string | null {
    return this.tests().find((t) => t.id === id)?.hydrozoneName ?? null;
  }
}
