import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { PeriodPicker, type PeriodValue } from './period-picker';

async function setup(value: PeriodValue) {
  const fixture = TestBed.createComponent(PeriodPicker);
  fixture.componentRef.setInput('value', value);
  const emitted: PeriodValue[] = [];
  fixture.componentInstance.changed.subscribe((v) => emitted.push(v));
  await fixture.whenStable();
  return { fixture, emitted, loader: TestbedHarnessEnvironment.loader(fixture) };
}

describe('PeriodPicker', () => {
  it('when a month is shown and "next" is pressed, then the following calendar month is chosen', async () => {
    const { fixture, emitted, loader } = await setup({ kind: 'month', from: '2025-12-01', to: '2025-12-31' });
    expect(fixture.nativeElement.textContent).toContain('Dec 2025');
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Next month"]' }))).click();
    expect(emitted).toEqual([{ kind: 'month', from: '2026-01-01', to: '2026-01-31' }]);
  });

  it('when "Water year" is chosen in June, then the period runs from the October before to September', async () => {
    const { emitted, loader } = await setup({ kind: 'month', from: '2025-06-01', to: '2025-06-30' });
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'Water year' }))).check();
    expect(emitted).toEqual([{ kind: 'water-year', from: '2024-10-01', to: '2025-09-30' }]);
  });

  it('when a water year is shown and "previous" is pressed, then the water year before is chosen', async () => {
    const { fixture, emitted, loader } = await setup({ kind: 'water-year', from: '2024-10-01', to: '2025-09-30' });
    expect(fixture.nativeElement.textContent).toContain('Water year 2025');
    await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Previous water year"]' }))).click();
    expect(emitted).toEqual([{ kind: 'water-year', from: '2023-10-01', to: '2024-09-30' }]);
  });

  it('when a custom range gets an end before its start, then nothing is emitted; a valid end is', async () => {
    const { fixture, emitted } = await setup({ kind: 'custom', from: '2025-06-10', to: '2025-06-20' });
    const toInput = (fixture.nativeElement as HTMLElement)
      .querySelectorAll<HTMLInputElement>('input[type=date]')
      .item(1);
    toInput!.value = '2025-06-01';
    toInput!.dispatchEvent(new Event('change'));
    expect(emitted).toEqual([]);
    toInput!.value = '2025-07-04';
    toInput!.dispatchEvent(new Event('change'));
    expect(emitted).toEqual([{ kind: 'custom', from: '2025-06-10', to: '2025-07-04' }]);
  });
});
