import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import type { ConflictSummaryDto, UploadDto } from '@shared/uploads/upload';
import { UploadOutcome } from './upload-outcome';

// An invented organisation-wide upload that touched two sites and met one stored conflict.
const UPLOAD: UploadDto = {
  id: 41,
  siteId: null,
  sites: [
    { siteId: 3, siteName: 'Quail Run Commons', accepted: 12, duplicate: 0, conflicting: 2, rejected: 0 },
    { siteId: 5, siteName: 'Mesa Verde Office Park', accepted: 6, duplicate: 0, conflicting: 0, rejected: 0 },
  ],
  unknownRefs: 1,
  kind: 'interval-long',
  fileName: 'customer-export.csv',
  sizeBytes: 2048,
  sha256: 'a'.repeat(64),
  status: 'done',
  errorSummary: null,
  mapping: null,
  uploadedBy: 'manager@quailrun.example',
  viaApiKey: null,
  createdAt: '2026-09-03T10:00:00Z',
  finishedAt: '2026-09-03T10:00:02Z',
  progressRows: 0,
  rowsRead: 26,
  accepted: 18,
  duplicate: 0,
  conflicting: 2,
  replaced: 0,
  rejected: 0,
};
const SUMMARY: ConflictSummaryDto = {
  days: [{ date: '2026-09-02', siteId: 3, kind: 'stored', readings: 2, storedGallons: 180, fileGallons: 196.5 }],
  open: { stored: 2, inFile: 0 },
};

describe('UploadOutcome', () => {
  it('when an upload met stored readings, then its days are listed and "replace these" sends that day', async () => {
    TestBed.configureTestingModule({
      imports: [UploadOutcome],
      providers: [provideHttpClient(), provideHttpClientTesting()],
    });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(UploadOutcome);
    fixture.componentRef.setInput('upload', UPLOAD);
    fixture.componentRef.setInput('canAct', true);
    fixture.detectChanges();
    http.expectOne((r) => r.url === '/api/uploads/41/rejections').flush({ items: [], total: 0 });
    http.expectOne('/api/uploads/41/conflicts').flush(SUMMARY);
    await fixture.whenStable();

    const text = (fixture.nativeElement as HTMLElement).textContent!;
    expect(text).toContain('Mesa Verde Office Park');
    expect(text).toContain('1 meter or controller identifier(s)');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Replace these 2 readings' }))).click();
    const req = http.expectOne('/api/uploads/41/conflicts/replace');
    expect(req.request.body).toEqual({ siteId: 3, date: '2026-09-02' });
    req.flush({ replaced: 2, upload: { ...UPLOAD, conflicting: 0, replaced: 2 } });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('2 reading(s) replaced.');
  });
});
