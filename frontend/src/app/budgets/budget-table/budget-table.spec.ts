import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { SiteBudgetDto } from '@shared/budgets/budget-dto';
import { BudgetTable } from './budget-table';

// An invented two-month budget for one hydrozone; figures worked by hand: 6 in × 0.5 × 1,000 ft² × 0.623377 ÷ 0.81.
function budget(unitSystem: 'us' | 'metric'): SiteBudgetDto {
  const zone = (gallons: number) => ({
    zoneId: 1,
    zoneName: 'Shrub bed',
    areaFt2: 1000,
    plantFactor: 0.5,
    irrigationEfficiency: 0.81,
    etoMm: 152.4,
    rainMm: 0,
    effectiveRainMm: 0,
    grossGallons: gallons,
    rainCreditGallons: 0,
    gallons,
    litres: gallons * 3.785411784,
    steps: [
      {
        label: 'Gross irrigation',
        formula: '6.000 in × 0.50 × 1,000 ft² × 0.623377 gal/(in·ft²) ÷ 0.81',
        value: gallons,
        unit: 'gal',
      },
    ],
  });
  return {
    siteId: 4,
    siteName: 'Cottonwood Flats Park',
    from: '2025-06',
    to: '2025-07',
    unitSystem,
    station: { id: 2, name: 'Sandwash station' },
    rainCredit: { kind: 'none', value: null, description: 'Rain is not credited.' },
    months: [
      {
        month: '2025-06',
        days: 30,
        partial: false,
        missingDates: [],
        estimatedDays: 0,
        daily: [],
        etoMm: 152.4,
        rainMm: 0,
        filledDays: 0,
        methods: ['measured'],
        gallons: 2308.8,
        litres: 8739.8,
        zones: [zone(2308.8)],
        indoorGallons: null,
        cost: null,
      },
      {
        month: '2025-07',
        days: 31,
        partial: false,
        missingDates: [],
        estimatedDays: 0,
        daily: [],
        etoMm: 152.4,
        rainMm: 25.4,
        filledDays: 2,
        methods: ['measured', 'normal-filled'],
        gallons: 2308.8,
        litres: 8739.8,
        zones: [zone(2308.8)],
        indoorGallons: null,
        cost: {
          scheduleId: 1,
          scheduleName: 'Uniform',
          unit: 'ccf',
          currency: 'USD',
          units: 3.086,
          fixedCharge: 20,
          volumeCharge: 12.34,
          total: 32.34,
          lines: [],
        },
      },
    ],
    totals: {
      gallons: 4617.6,
      litres: 17479.6,
      indoorGallons: null,
      etoMm: 304.8,
      rainMm: 25.4,
      filledDays: 2,
      cost: null,
      currency: 'USD',
    },
    indoor: null,
    formula: 'Per hydrozone and day',
    sources: [],
  };
}

describe('BudgetTable', () => {
  async function render(unitSystem: 'us' | 'metric') {
    TestBed.configureTestingModule({ imports: [BudgetTable] });
    const fixture = TestBed.createComponent(BudgetTable);
    fixture.componentRef.setInput('budget', budget(unitSystem));
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const table = await loader.getHarness(MatTableHarness);
    const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
    return { fixture, loader, table, text };
  }

  it(
    'when shown in US units, then each month has ETo in inches, budget ' + 'in gallons, cost, and filled days flagged',
    async () => {
      const { table } = await render('us');
      const rows = (await table.getCellTextByColumnName()) as unknown as Record<string, { text: string[] }>;
      expect(rows['month']!.text.map((t) => t.replace(/\s+/g, ' '))).toEqual(['Jun 2025', 'Jul 2025 2 filled']);
      expect(rows['eto']!.text).toEqual(['6.00 in', '6.00 in']);
      expect(rows['rain']!.text).toEqual(['0.00 in', '1.00 in']);
      expect(rows['budget']!.text).toEqual(['2,309 gal', '2,309 gal']);
      expect(rows['cost']!.text).toEqual(['no rate', '$32.34']);
      const footer = await (await table.getFooterRows())[0]!.getCellTextByColumnName();
      expect(footer['budget']).toBe('4,618 gal');
    },
  );

  it('when shown in metric, then depths are in mm and volumes in m³', async () => {
    const { table } = await render('metric');
    const rows = (await table.getCellTextByColumnName()) as unknown as Record<string, { text: string[] }>;
    expect(rows['eto']!.text[0]).toBe('152.4 mm');
    // 2,308.8 gal × 0.003785411784 m³/gal = 8.74 m³
    expect(rows['budget']!.text[0]).toBe('8.74 m³');
  });

  it('when an indoor allotment was asked for, then an indoor column shows it with its unit', async () => {
    TestBed.configureTestingModule({ imports: [BudgetTable] });
    const fixture = TestBed.createComponent(BudgetTable);
    const b = budget('us');
    b.indoor = { occupants: 10, gallonsPerPersonPerDay: 50 };
    b.months[0]!.indoorGallons = 15000;
    b.months[1]!.indoorGallons = 15500;
    b.totals.indoorGallons = 30500;
    fixture.componentRef.setInput('budget', b);
    await fixture.whenStable();
    const table = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatTableHarness);
    const rows = (await table.getCellTextByColumnName()) as unknown as Record<string, { text: string[] }>;
    expect(rows['indoor']!.text).toEqual(['15,000 gal', '15,500 gal']);
  });

  it('when "How computed" is opened for a month, then its hand calculation and weather sources appear', async () => {
    const { loader, text } = await render('us');
    expect(text()).not.toContain('0.623377 gal/(in·ft²)');
    const [, july] = await loader.getAllHarnesses(MatButtonHarness.with({ text: 'How computed' }));
    await july!.click();
    expect(text()).toContain('6.000 in × 0.50 × 1,000 ft² × 0.623377 gal/(in·ft²) ÷ 0.81');
    expect(text()).toContain("2 day(s) filled from the station's monthly normals.");
    expect(text()).toContain('Filled from monthly normals');
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: 'Hide working' }))).isDisabled()).toBe(false);
  });
});
