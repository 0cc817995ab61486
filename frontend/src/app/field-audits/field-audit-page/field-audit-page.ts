import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import type {
  ApplyZoneTestInput,
  FaultDto,
  FaultInput,
  FieldAuditDto,
  ZoneTestDto,
  ZoneTestInput,
} from '@shared/field-audits/field-audit-dto';
import { firstValueFrom, type Observable } from 'rxjs';
import { describeApiError } from '../../core/http/api-error';
import { HydrozonesApi } from '../../hydrozones/hydrozones-api';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { ApplyDialog } from '../apply-dialog/apply-dialog';
import { CatchCanForm } from '../catch-can-form/catch-can-form';
import { FaultList, type PhotoPick } from '../fault-list/fault-list';
import { FieldAuditsApi } from '../field-audits-api';
import { ZoneTestCard } from '../zone-test-card/zone-test-card';

/** `/sites/:id/audits/:auditId`: one audit, entered and read on a phone at the site. */
@Component({
  selector: 'rm-field-audit-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, CatchCanForm, FaultList, ZoneTestCard],
  templateUrl: './field-audit-page.html',
  styleUrl: './field-audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldAuditPage {
  private readonly api = inject(FieldAuditsApi);
  private readonly zonesApi = inject(HydrozonesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snack = inject(MatSnackBar);
  private readonly router = inject(Router);

  readonly id = input.required<string>();
  readonly auditId = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));

  protected readonly loaded = rxResource({
    params: () => Number(this.auditId()),
    stream: ({ params }) => this.api.get(params),
  });
  /** The latest audit: a write answers with the whole audit, which replaces what was loaded. */
  private readonly written = signal<FieldAuditDto | null>(null);
  protected readonly audit = computed(() => this.written() ?? (this.loaded.hasValue() ? this.loaded.value() : null));
  protected readonly zones = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.zonesApi.list(params),
  });
  protected readonly zoneList = computed(() => (this.zones.hasValue() ? this.zones.value().items : []));
  protected readonly loadError = computed(() => {
    const err = this.loaded.error();
    return err ? describeApiError(err, 'The audit could not be loaded.').message : null;
  });

  /** 'new', a test id being edited, or nothing. */
  protected readonly editingTest = signal<number | 'new' | null>(null);
  protected readonly busy = signal(false);
  protected readonly formProblem = signal<string | null>(null);

  protected readonly reportUrl = computed(() => this.api.reportUrl(Number(this.auditId())));

  protected testBeingEdited(): ZoneTestDto | null {
    const id = this.editingTest();
    return typeof id === 'number' ? (this.audit()?.zoneTests.find((t) => t.id === id) ?? null) : null;
  }

  protected async saveTest(input: ZoneTestInput): Promise<void> {
    const editing = this.editingTest();
    const id = Number(this.auditId());
    const ok = await this.write(
      editing === 'new' || editing === null ? this.api.addTest(id, input) : this.api.updateTest(id, editing, input),
      'The test could not be saved.',
      true,
    );
    if (ok) this.editingTest.set(null);
  }

  protected async removeTest(t: ZoneTestDto): Promise<void> {
    if (!(await this.ask('Delete zone test?', `The catch-can test of "${t.hydrozoneName}" is removed.`))) return;
    await this.removeThen(this.api.removeTest(Number(this.auditId()), t.id));
  }

  protected async applyTest(t: ZoneTestDto): Promise<void> {
    const choice = await firstValueFrom(
      this.dialog.open<ApplyDialog, ZoneTestDto, ApplyZoneTestInput | null>(ApplyDialog, { data: t }).afterClosed(),
    );
    if (!choice) return;
    if (await this.write(this.api.apply(Number(this.auditId()), t.id, choice), 'The results could not be written.'))
      this.snack.open(`Written into "${t.hydrozoneName}".`, undefined, { duration: 4000 });
  }

  protected async addFault(input: FaultInput): Promise<void> {
    await this.write(this.api.addFault(Number(this.auditId()), input), 'The fault could not be saved.');
  }

  protected async updateFault(e: { id: number; input: FaultInput }): Promise<void> {
    await this.write(this.api.updateFault(Number(this.auditId()), e.id, e.input), 'The fault could not be saved.');
  }

  protected async removeFault(f: FaultDto): Promise<void> {
    if (!(await this.ask('Delete fault?', `"${f.location}" and its photos are removed from the audit.`))) return;
    await this.removeThen(this.api.removeFault(Number(this.auditId()), f.id));
  }

  protected async addPhoto(p: PhotoPick): Promise<void> {
    await this.write(this.api.addPhoto(Number(this.auditId()), p.faultId, p.file), 'The photo could not be stored.');
  }

  protected async removePhoto(url: string): Promise<void> {
    if (!(await this.ask('Remove photo?', 'The photo is removed from the fault.'))) return;
    await this.removeThen(this.api.removePhoto(url));
  }

  protected async setStatus(status: 'draft' | 'complete'): Promise<void> {
    await this.write(this.api.update(Number(this.auditId()), { status }), 'The audit could not be saved.');
  }

  protected async deleteAudit(): Promise<void> {
    const a = this.audit();
    if (!a || !(await this.ask('Delete audit?', `"${a.title}", its tests, faults and photos are removed.`))) return;
    try {
      await firstValueFrom(this.api.remove(a.id));
      await this.router.navigate(['/sites', this.siteId(), 'audits']);
    } catch (err) {
      this.snack.open(describeApiError(err, 'The audit could not be deleted.').message, 'Close');
    }
  }

  /** Runs a write and shows its answer; a failure is a message (in the open form, or a snack bar). */
  private async write(
    request: Observable<FieldAuditDto> | (() => Promise<FieldAuditDto>),
    fallback: string,
    inForm = false,
  ): Promise<boolean> {
    this.busy.set(true);
    this.formProblem.set(null);
    try {
      this.written.set(await (typeof request === 'function' ? request() : firstValueFrom(request)));
      return true;
    } catch (err) {
      const message = describeApiError(err, fallback).message;
      if (inForm) this.formProblem.set(message);
      else this.snack.open(message, 'Close');
      return false;
    } finally {
      this.busy.set(false);
    }
  }

  /** A delete answers with no body: read the audit again after it. */
  private async removeThen(request: Observable<void>): Promise<void> {
    await this.write(async () => {
      await firstValueFrom(request, { defaultValue: undefined });
      return firstValueFrom(this.api.get(Number(this.auditId())));
    }, 'That could not be removed.');
  }

  private ask(title: string, message: string): Promise<boolean> {
    return confirm(this.dialog, { title, message, confirmLabel: 'Delete', danger: true });
  }
}
