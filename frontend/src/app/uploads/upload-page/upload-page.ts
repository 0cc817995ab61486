import { HttpErrorResponse, HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute } from '@angular/router';
import type { IngestRecord } from '@shared/ingest/ingest-records';
import { validateMapping } from '@shared/ingest/mapping-validation';
import { DATE_ORDER_LABELS, DATE_ORDERS, describeDateOrder, type DateOrder } from '@shared/ingest/date-order';
import { interpretRows, type Interpretation } from '@shared/ingest/row-reader';
import type { ColumnMapping } from '@shared/ingest/upload-kind';
import type { SiteDto } from '@shared/sites/site';
import { VOLUME_UNIT_LABELS } from '@shared/units/volume-units';
import type {
  ImportProfileDto,
  InFileRepeatPolicy,
  RowErrorPolicy,
  UploadDto,
  UploadResult,
} from '@shared/uploads/upload';
import { Subscription, interval } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { confirm } from '../../shared/confirm-dialog/confirm-dialog';
import { OrganisationApi } from '../../shared/unit-system/organisation-api';
import { MetersApi } from '../../meters/meters-api';
import { SitesApi } from '../../sites/sites-api';
import { ColumnMappingEditor } from '../column-mapping-editor/column-mapping-editor';
import { UploadHistory } from '../upload-history/upload-history';
import { UploadOutcome } from '../upload-outcome/upload-outcome';
import { UploadsApi } from '../uploads-api';
import { newClientRef, previewFile, type FilePreview } from './file-preview';

type Phase = 'idle' | 'sending' | 'processing' | 'finished' | 'failed';

/** The site choice that means the whole organisation (no site has id 0). */
const ORGANISATION = 0;

/** A mapping as the page keeps it: the day/month order is the person's choice or the whole file's, kept apart. */
function withoutDateOrder(mapping: ColumnMapping | null): ColumnMapping | null {
  if (!mapping) return null;
  const copy = { ...mapping };
  delete copy.dateOrder;
  return copy;
}

/** Drop a CSV, check how it will be read, send it, and see what came of it; earlier uploads below. */
@Component({
  selector: 'rm-upload-page',
  imports: [
    FormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatSelectModule,
    ColumnMappingEditor,
    UploadHistory,
    UploadOutcome,
  ],
  templateUrl: './upload-page.html',
  styleUrl: './upload-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadPage {
  private readonly api = inject(UploadsApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly metersApi = inject(MetersApi);
  private readonly dialog = inject(MatDialog);
  private readonly organisationApi = inject(OrganisationApi);
  /** Administrators may make a chosen order the organisation's usual one. */
  private readonly auth = inject(AuthStore);
  protected readonly canSetUsualOrder = computed(() => this.auth.capabilities().manageSettings);
  private polling?: Subscription;

  protected readonly sites = signal<SiteDto[]>([]);
  /** A site, or ORGANISATION: one file for many sites, each row routed by its meter or controller. */
  protected readonly siteId = signal<number | null>(null);
  protected readonly organisationWide = computed(() => this.siteId() === ORGANISATION);
  protected readonly site = computed(() => this.sites().find((s) => s.id === this.siteId()) ?? null);
  /** The site whose time zone the preview reads in (an organisation's upload: each row's own site on the server). */
  private readonly previewSite = computed(() => this.site() ?? (this.organisationWide() ? this.sites()[0] : null));
  protected readonly canUpload = computed(() =>
    this.organisationWide()
      ? this.sites().some((s) => s.access !== 'read')
      : !!this.site() && this.site()!.access !== 'read',
  );
  protected readonly meterRefs = signal<string[]>([]);
  protected readonly profiles = signal<ImportProfileDto[]>([]);
  protected readonly history = signal<UploadDto[]>([]);

  protected readonly file = signal<File | null>(null);
  protected readonly preview = signal<FilePreview | null>(null);
  protected readonly mapping = signal<ColumnMapping | null>(null);
  protected readonly interpretation = computed<Interpretation | null>(() => {
    const preview = this.preview();
    const site = this.previewSite();
    if (!preview?.ok || !site) return null;
    const mapping = this.mapping();
    return interpretRows(preview.rows, {
      timeZone: site.timeZone,
      now: Date.now(),
      delimiter: preview.delimiter,
      mapping: mapping ?? undefined,
      dateOrder: this.chosenDateOrder() ?? undefined,
      organisationDateOrder: this.usualDateOrder(),
    });
  });
  protected readonly problems = computed(() => {
    const i = this.interpretation();
    if (!i) return [];
    const mapping = this.mapping();
    return [...i.fileProblems, ...(mapping ? validateMapping(mapping).map((p) => p.message) : [])];
  });
  protected readonly sampleRecords = computed(() =>
    (this.interpretation()?.records ?? []).slice(0, 8).map((r) => this.describe(r)),
  );
  /** The day/month order as the preview decided it, with its evidence, or the question when it cannot. */
  protected readonly dateDecision = computed(() => this.interpretation()?.dateOrder ?? null);
  protected readonly dateNote = computed(() => {
    const d = this.dateDecision();
    return d && d.kind !== 'not-needed' ? describeDateOrder(d) : null;
  });
  /** Ask when the preview cannot decide, or when the server refused the file as ambiguous. */
  protected readonly askDateOrder = computed(() => {
    const kind = this.dateDecision()?.kind;
    return kind === 'ambiguous' || kind === 'contradictory' || this.serverAsked() || this.chosenDateOrder() !== null;
  });
  private readonly serverAsked = signal(false);
  /** Chosen by the person; otherwise the server decides from the whole file (the preview sees its head). */
  protected readonly chosenDateOrder = signal<DateOrder | null>(null);
  /** The organisation's usual order (settings), as the server applies it to files whose dates fit both. */
  protected readonly usualDateOrder = signal<DateOrder | null>(null);
  protected readonly dateOrders = DATE_ORDERS;
  protected readonly dateOrderLabels = DATE_ORDER_LABELS;
  protected readonly replaceConflicts = signal(false);
  protected readonly rowErrors = signal<RowErrorPolicy>('keep-valid');
  protected readonly repeats = signal<InFileRepeatPolicy>('not-stored');
  protected readonly profileName = signal('');

  protected readonly phase = signal<Phase>('idle');
  protected readonly sentPercent = signal(0);
  protected readonly processedRows = signal(0);
  protected readonly result = signal<UploadResult | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly shown = signal<UploadDto | null>(null);
  protected readonly organisation = ORGANISATION;
  protected readonly dragging = signal(false);
  protected readonly unitLabels = VOLUME_UNIT_LABELS;

  constructor() {
    // A site's workspace links here with ?site=<id> so the file goes to that site.
    const wanted = Number(inject(ActivatedRoute).snapshot.queryParamMap.get('site'));
    this.sitesApi
      .list({ page: 0, pageSize: 200, sort: 'name', dir: 'asc', q: '', tag: '', kind: '' })
      .subscribe((page) => {
        this.sites.set(page.items);
        const first = page.items.find((s) => s.id === wanted) ?? page.items[0];
        if (first && this.siteId() === null) this.chooseSite(first.id);
      });
    this.api.profiles().subscribe((p) => this.profiles.set(p));
    this.organisationApi.settings().subscribe((s) => this.usualDateOrder.set(s.dateOrder));
    inject(DestroyRef).onDestroy(() => this.polling?.unsubscribe());
  }

  protected chooseSite(id: number): void {
    this.siteId.set(id);
    this.meterRefs.set([]);
    if (id !== ORGANISATION) this.metersApi.meters(id).subscribe((m) => this.meterRefs.set(m.map((x) => x.ref)));
    this.refreshHistory();
  }

  protected chooseDateOrder(order: DateOrder): void {
    this.chosenDateOrder.set(order);
  }

  protected makeUsualDateOrder(order: DateOrder): void {
    this.organisationApi.setDateOrder(order).subscribe({
      next: (s) => this.usualDateOrder.set(s.dateOrder),
      error: (e: HttpErrorResponse) => this.error.set(e.error?.error?.message ?? 'The setting could not be saved.'),
    });
  }

  protected dragOver(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(true);
  }

  protected drop(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files?.[0];
    if (file) void this.chooseFile(file);
  }

  protected pick(input: HTMLInputElement): void {
    const file = input.files?.[0];
    if (file) void this.chooseFile(file);
    input.value = '';
  }

  async chooseFile(file: File): Promise<void> {
    this.file.set(file);
    this.result.set(null);
    this.error.set(null);
    this.shown.set(null);
    this.serverAsked.set(false);
    this.chosenDateOrder.set(null);
    this.phase.set('idle');
    this.mapping.set(null);
    const preview = await previewFile(file);
    this.preview.set(preview);
    this.mapping.set(withoutDateOrder(this.interpretation()?.mapping ?? null));
  }

  protected useProfile(profile: ImportProfileDto | null): void {
    const preview = this.preview();
    if (!profile || !preview?.ok) return;
    this.mapping.set(withoutDateOrder({ ...profile.mapping, header: preview.rows[0] ?? [] }));
    // A profile's saved day/month order counts as chosen.
    if (profile.mapping.dateOrder) this.chosenDateOrder.set(profile.mapping.dateOrder);
  }

  protected saveProfile(): void {
    const confirmed = this.mapping();
    const order = this.chosenDateOrder();
    const mapping = confirmed && order ? { ...confirmed, dateOrder: order } : confirmed;
    const name = this.profileName().trim();
    if (!mapping || !name) return;
    this.api.saveProfile(name, mapping).subscribe({
      next: (p) => (this.profiles.update((list) => [...list, p]), this.profileName.set('')),
      error: (e: HttpErrorResponse) => this.error.set(e.error?.error?.message ?? 'The profile could not be saved.'),
    });
  }

  protected send(): void {
    const file = this.file();
    const chosen = this.siteId();
    const confirmed = this.mapping();
    if (!file || chosen === null || !confirmed) return;
    const order = this.chosenDateOrder();
    const mapping = order ? { ...confirmed, dateOrder: order } : confirmed;
    const siteId = chosen === ORGANISATION ? null : chosen;
    const clientRef = newClientRef();
    this.phase.set('sending');
    this.sentPercent.set(0);
    this.processedRows.set(0);
    this.error.set(null);
    const fields = {
      mapping: JSON.stringify(mapping),
      replaceConflicts: String(this.replaceConflicts()),
      rowErrors: this.rowErrors(),
      repeats: this.repeats(),
      clientRef,
      ...(order ? { dateOrder: order } : {}),
    };
    this.api.upload(siteId, file, fields).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) {
          this.sentPercent.set(Math.round((100 * event.loaded) / (event.total ?? file.size)));
          if (event.loaded >= (event.total ?? file.size)) this.startPolling(siteId, clientRef);
        } else if (event.type === HttpEventType.Response && event.body) {
          this.finish();
          this.phase.set('finished');
          this.result.set(event.body);
          this.showUpload(event.body.upload);
        }
      },
      error: (e: HttpErrorResponse) => {
        this.finish();
        this.phase.set('failed');
        this.error.set(e.error?.error?.message ?? 'The upload did not reach the server.');
        if (e.error?.error?.code === 'date_order_ambiguous') this.serverAsked.set(true);
        const details: Array<{ field: string; message: string }> = e.error?.error?.details ?? [];
        if (details.length)
          this.error.update((m) => `${m} ${details.map((d) => `${d.field}: ${d.message}`).join('; ')}`);
      },
    });
  }

  protected showUpload(upload: UploadDto): void {
    this.shown.set(upload);
  }

  protected changed(upload: UploadDto): void {
    this.shown.set(upload);
    this.refreshHistory();
  }

  protected async rollBack(upload: UploadDto): Promise<void> {
    const ok = await confirm(this.dialog, {
      title: `Roll back upload #${upload.id}?`,
      message:
        `Removes the ${upload.accepted} readings or runs "${upload.fileName}" ` +
        'stored, and puts back any values it replaced.',
      confirmLabel: 'Roll back',
      danger: true,
    });
    if (!ok) return;
    this.api.rollBack(upload.id).subscribe({
      next: () => this.refreshHistory(),
      error: (e: HttpErrorResponse) => this.error.set(e.error?.error?.message ?? 'Roll back failed.'),
    });
  }

  private startPolling(siteId: number | null, clientRef: string): void {
    if (this.polling) return;
    this.phase.set('processing');
    this.polling = interval(700).subscribe(() =>
      this.api
        .list(siteId, 0, clientRef)
        .subscribe((page) => this.processedRows.set(page.items[0]?.progressRows ?? this.processedRows())),
    );
  }

  private finish(): void {
    this.polling?.unsubscribe();
    this.polling = undefined;
    this.refreshHistory();
  }

  private refreshHistory(): void {
    const id = this.siteId();
    if (id !== null) this.api.list(id === ORGANISATION ? null : id).subscribe((page) => this.history.set(page.items));
  }

  private describe(r: IngestRecord): string {
    const local = (iso: string) =>
      new Date(iso).toLocaleString('en-CA', { timeZone: this.previewSite()!.timeZone, hour12: false }).replace(',', '');
    if ('controllerRef' in r)
      return (
        `${r.controllerRef} station ${r.station} · ${local(r.startUtc)} ` +
        `· ${r.minutes} min · ${r.cause ?? 'cause not given'}`
      );
    if ('atUtc' in r)
      return `${r.meterRef} · read at ${local(r.atUtc)} · register ${r.value} ${this.unitLabels[r.unit]}`;
    if ('startDate' in r)
      return `${r.meterRef} · bill ${r.startDate} – ${r.endDate} · ${r.volume} ${this.unitLabels[r.unit]}`;
    return `${r.meterRef} · ${local(r.startUtc)} · ${r.minutes} min · ${r.volume} ${this.unitLabels[r.unit]}`;
  }
}
