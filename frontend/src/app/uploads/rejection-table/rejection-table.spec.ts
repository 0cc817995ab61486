import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { RejectionDto } from '@shared/uploads/upload';
import { RejectionTable } from './rejection-table';

const rows: RejectionDto[] = [
  { row: 3, column: 3, kind: 'rejected', message: 'Usage (Gal): "n/a" is not a number' },
  {
    row: 4,
    column: null,
    kind: 'conflict',
    message:
      'meter LARK-07, 60 min from 2026-11-20 10:00 UTC: stored 2.5 ' +
      'gal (upload #4), this file 99 gal; the stored value was kept.',
  },
  {
    row: 0,
    column: null,
    kind: 'notice',
    message: '2 record(s) repeat a meter/zone and interval given earlier in this file; the first of each was kept.',
  },
];

describe('RejectionTable', () => {
  async function setUp(total = rows.length) {
    TestBed.configureTestingModule({ imports: [RejectionTable] });
    const fixture = TestBed.createComponent(RejectionTable);
    fixture.componentRef.setInput('rejections', rows);
    fixture.componentRef.setInput('total', total);
    fixture.componentRef.setInput('csvUrl', '/api/uploads/12/rejections?format=csv');
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('when rows were rejected, then each shows its row, column, what happened and why', async () => {
    const { loader } = await setUp();
    const table = await loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByIndex();
    expect(cells).toEqual([
      ['3', '3', 'Not imported', 'Usage (Gal): "n/a" is not a number'],
      ['4', '—', 'Differs from stored', rows[1]!.message],
      ['—', '—', 'Note', rows[2]!.message],
    ]);
  });

  it('when the list is downloaded, then the link points at the CSV of this upload', async () => {
    const { loader } = await setUp();
    const link = await loader.getHarness(MatButtonHarness.with({ text: /Download as CSV/ }));
    expect(await (await link.host()).getAttribute('href')).toBe('/api/uploads/12/rejections?format=csv');
  });

  it('when there are more than shown, then it says how many the CSV has', async () => {
    const { fixture } = await setUp(5000);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('the CSV has all 5000');
  });
});
