import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { atLeast } from '@shared/auth/roles';
import type { UploadDto } from '@shared/uploads/upload';
import { describeApiError } from '../../core/http/api-error';
import { SitesApi } from '../../sites/sites-api';
import { RejectionTable } from '../rejection-table/rejection-table';
import { UploadHistory } from '../upload-history/upload-history';
import { UploadsApi } from '../uploads-api';

/** `/sites/:id/uploads`: the files sent for this site, newest first; new files go through the upload page. */
@Component({
  selector: 'rm-site-uploads',
  imports: [
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatPaginatorModule,
    MatProgressBarModule,
    UploadHistory,
    RejectionTable,
  ],
  templateUrl: './site-uploads.html',
  styleUrl: './site-uploads.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SiteUploads {
  private readonly api = inject(UploadsApi);
  private readonly sitesApi = inject(SitesApi);

  /** Route parameter. */
  readonly id = input.required<string>();
  protected readonly siteId = computed(() => Number(this.id()));
  protected readonly pageIndex = signal(0);
  protected readonly site = rxResource({
    params: () => this.siteId(),
    stream: ({ params }) => this.sitesApi.get(params),
  });
  protected readonly uploads = rxResource({
    params: () => ({ id: this.siteId(), page: this.pageIndex() }),
    stream: ({ params }) => this.api.list(params.id, params.page),
  });
  protected readonly canUpload = computed(
    () => this.site.hasValue() && atLeast(this.site.value().access, 'contribute'),
  );
  protected readonly error = computed(() => {
    const err = this.site.error() ?? this.uploads.error();
    return err ? describeApiError(err, 'The uploads could not be loaded.').message : null;
  });

  protected readonly shown = signal<UploadDto | null>(null);
  protected readonly rejections = rxResource({
    params: () => this.shown()?.id,
    stream: ({ params }) => this.api.rejections(params),
  });

  protected retry(): void {
    if (this.site.error()) this.site.reload();
    this.uploads.reload();
  }

  protected showUpload(upload: UploadDto): void {
    this.shown.set(upload);
  }

  protected turnPage(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
  }

  protected csvUrl(id: number): string {
    return this.api.rejectionsCsvUrl(id);
  }
}
