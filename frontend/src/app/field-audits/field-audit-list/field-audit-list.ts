import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { describeApiError } from '../../core/http/api-error';
import { SitesApi } from '../../sites/sites-api';
import { siteDate } from '../../sites/site-date';
import { mayRecordAudits } from '../audit-permissions';
import { FieldAuditsApi } from '../field-audits-api';

/** `/sites/:id/audits`: the site's irrigation audits, newest first, and starting a new one. */
@Component({
  selector: 'rm-field-audit-list',
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
  ],
  templateUrl: './field-audit-list.html',
  styleUrl: './field-audit-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldAuditList {
  private readonly api = inject(FieldAuditsApi);
  private readonly sitesApi = inject(SitesApi);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);

  /** Route parameter (inherited from /sites/:id). */
  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));

  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly audits = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.api.list(params),
  });
  protected readonly canRecord = computed(() =>
    mayRecordAudits(this.auth.user()?.organisation.role, this.site.hasValue() ? this.site.value().access : undefined),
  );
  protected readonly error = computed(() => {
    const err = this.audits.error();
    return err ? describeApiError(err, 'The audits could not be loaded.').message : null;
  });

  protected readonly starting = signal(false);
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected title = '';
  protected auditedOn = '';
  protected daysPerWeek = 3;
  protected staticPressurePsi: number | null = null;

  protected start(): void {
    const today = this.site.hasValue() ? siteDate(this.site.value().timeZone) : new Date().toISOString().slice(0, 10);
    this.title = `Irrigation audit ${today}`;
    this.auditedOn = today;
    this.formError.set(null);
    this.starting.set(true);
  }

  protected async create(): Promise<void> {
    this.saving.set(true);
    this.formError.set(null);
    try {
      const audit = await firstValueFrom(
        this.api.create(this.siteId(), {
          title: this.title,
          auditedOn: this.auditedOn,
          scheduleMonth: this.auditedOn.slice(0, 7),
          daysPerWeek: Number(this.daysPerWeek),
          staticPressurePsi: this.staticPressurePsi === null ? null : Number(this.staticPressurePsi),
        }),
      );
      await this.router.navigate(['/sites', this.siteId(), 'audits', audit.id]);
    } catch (err) {
      this.formError.set(describeApiError(err, 'The audit could not be started.').message);
    } finally {
      this.saving.set(false);
    }
  }

  protected percent(du: number | null): string {
    return du === null ? '—' : `${Math.round(100 * du)} %`;
  }
}
