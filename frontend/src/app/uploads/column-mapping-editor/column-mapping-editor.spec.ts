import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { ColumnMapping } from '@shared/ingest/upload-kind';
import { ColumnMappingEditor } from './column-mapping-editor';

// An invented export with no meter column (a single-meter file).
const detected: ColumnMapping = {
  kind: 'interval-long',
  header: ['Interval Start', 'Consumption CCF', 'Remark'],
  columns: { timestamp: 0, value: 1 },
  unit: 'ccf',
  intervalMinutes: 60,
};

describe('ColumnMappingEditor', () => {
  async function setUp(mapping = detected) {
    TestBed.configureTestingModule({ imports: [ColumnMappingEditor] });
    const fixture = TestBed.createComponent(ColumnMappingEditor);
    fixture.componentRef.setInput('mapping', mapping);
    fixture.componentRef.setInput('meterRefs', ['LARK-07', 'LARK-08']);
    const emitted: ColumnMapping[] = [];
    fixture.componentInstance.mappingChange.subscribe((m) => emitted.push(m));
    await fixture.whenStable();
    return { fixture, emitted, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('when a file is detected, then each field shows the column it was matched to', async () => {
    const { loader } = await setUp();
    const selects = await loader.getAllHarnesses(MatSelectHarness);
    const values = await Promise.all(selects.map((s) => s.getValueText()));
    expect(values).toContain('1. Interval Start');
    expect(values).toContain('2. Consumption CCF');
  });

  it('when the volume is pointed at another column, then the new mapping is emitted with that column', async () => {
    const { loader, emitted } = await setUp();
    const selects = await loader.getAllHarnesses(MatSelectHarness);
    const texts = await Promise.all(selects.map((s) => s.getValueText()));
    const value = selects[texts.indexOf('2. Consumption CCF')]!;
    await value.open();
    await value.clickOptions({ text: '3. Remark' });
    expect(emitted.at(-1)!.columns).toEqual({ timestamp: 0, value: 2 });
  });

  it('when the file has no meter column, then the meter for every row can be chosen from the site', async () => {
    const { loader, emitted } = await setUp();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Meter for every row' }));
    const meterSelect = (await field.getControl(MatSelectHarness))!;
    await meterSelect.open();
    await meterSelect.clickOptions({ text: 'LARK-08' });
    expect(emitted.at(-1)!.fixedMeterRef).toBe('LARK-08');
  });

  it('when the kind is changed to a run log, then the run fields are offered instead', async () => {
    const { fixture, loader } = await setUp({ ...detected, kind: 'runtime', columns: {} });
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('run start');
    expect(text).toContain('station / zone');
    expect(text).not.toContain('Meter for every row');
    expect((await loader.getAllHarnesses(MatSelectHarness)).length).toBe(9);
  });
});
