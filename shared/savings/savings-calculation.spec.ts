import { describe, expect, it } from 'vitest';
import { costOfVolume } from '../rates/water-cost';
import type { RateSchedule } from '../rates/rate-schedule';
import { fitBaselineModel, type BaselineModelForm, type MeteredPeriod } from './baseline-model';
import { calculateSavings } from './savings-calculation';

// Invented monthly weather (mm) and use built from known coefficients.
const DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const ETO = [50, 65, 95, 125, 155, 175, 190, 170, 130, 90, 60, 45];
const RAIN = [90, 80, 60, 25, 8, 1, 0, 0, 5, 20, 50, 85];
const NOISE = [900, -1200, 400, -300, 1500, -800, -600, 1100, -700, 200, -900, 400];
const truth = (i: number): number => 2000 + 400 * ETO[i]! - 120 * RAIN[i]!;

function months(use: (i: number) => number, etoShift = 0): MeteredPeriod[] {
  return DAYS.map((days, i) => ({
    label: `M${i + 1}`,
    days,
    etoMm: ETO[i]! + etoShift,
    rainMm: RAIN[i]!,
    useGal: use(i),
  }));
}

const CCF_GAL = 172_800 / 231;
const uniform: RateSchedule = {
  name: 'Invented uniform',
  unit: 'ccf',
  currency: 'USD',
  fixedChargePerPeriod: 25,
  volumeCharge: { kind: 'uniform', pricePerUnit: 5 },
};

describe('weather-normalised savings', () => {
  const model = fitBaselineModel(
    months((i) => truth(i) + NOISE[i]!),
    'eto-rain',
  );

  it(
    'when the site uses 70 % of what the baseline predicts in a hotter ' +
      'year, then savings are 30 % of the prediction',
    () => {
      // A hotter reporting year (+5 mm ETo each month): comparing raw use would understate the savings.
      const hotter = months(() => 0, 5);
      const predicted = hotter.map(
        (p) =>
          model.coefficients[0]!.value +
          model.coefficients[1]!.value * p.etoMm +
          model.coefficients[2]!.value * p.rainMm,
      );
      const reporting = hotter.map((p, i) => ({ ...p, useGal: 0.7 * predicted[i]! }));
      const savings = calculateSavings(model, reporting);
      expect(savings.savedPercent).toBeCloseTo(30, 10);
      expect(savings.savedGal).toBeCloseTo(0.3 * savings.predictedGal, 6);
      expect(savings.periods[6]!.savedGal).toBeCloseTo(0.3 * predicted[6]!, 6);
      expect(savings.reportingDays).toBe(365);
      expect(savings.warnings).toEqual([]);
    },
  );

  it('when priced at $5/CCF plus a fixed charge, then money saved is $5 × CCF saved (the fixed charge cancels)', () => {
    const reporting = months((i) => 0.8 * truth(i));
    const savings = calculateSavings(model, reporting, { price: (gal) => costOfVolume(uniform, gal).total });
    expect(savings.savedMoney).not.toBeNull();
    // Each period's cost is rounded to cents, so allow a cent per period.
    expect(Math.abs(savings.savedMoney! - (5 * savings.savedGal) / CCF_GAL)).toBeLessThanOrEqual(0.12);
    expect(savings.periods[0]!.savedMoney).toBeCloseTo((5 * savings.periods[0]!.savedGal) / CCF_GAL, 1);
  });

  it('when no price is given, then money is null rather than zero', () => {
    const savings = calculateSavings(
      model,
      months((i) => truth(i)),
    );
    expect(savings.savedMoney).toBeNull();
    expect(savings.periods[0]!.savedMoney).toBeNull();
  });

  it(
    'when the reporting weather is far outside the baseline, then ' +
      'it warns of extrapolation and negative predictions',
    () => {
      const odd: MeteredPeriod[] = [{ label: 'Deluge', days: 30, etoMm: 20, rainMm: 400, useGal: 0 }];
      const savings = calculateSavings(model, odd, { price: (gal) => costOfVolume(uniform, gal).total });
      expect(savings.warnings.join(' ')).toMatch(/negative use for Deluge/);
      expect(savings.warnings.join(' ')).toMatch(/Deluge is outside the baseline's range/);
      // Negative predicted use is priced as none: no money saved, no exception from the rate engine.
      expect(savings.savedMoney).toBe(0);
    },
  );

  it('when the confidence changes, then the interval scales by the t ratio and the standard error does not', () => {
    const reporting = months((i) => 0.8 * truth(i));
    const at68 = calculateSavings(model, reporting);
    const at90 = calculateSavings(model, reporting, { confidence: 0.9 });
    expect(at68.uncertainty.confidence).toBe(0.68);
    expect(at68.uncertainty.degreesOfFreedom).toBe(9);
    expect(at90.uncertainty.standardErrorGal).toBeCloseTo(at68.uncertainty.standardErrorGal, 9);
    expect(at90.uncertainty.plusMinusGal / at68.uncertainty.plusMinusGal).toBeCloseTo(
      at90.uncertainty.t / at68.uncertainty.t,
      12,
    );
    expect(at68.uncertainty.fractional).toBeCloseTo(at68.uncertainty.plusMinusGal / at68.savedGal, 12);
  });
});

/** Deterministic pseudo-random normals (mulberry32 + Box–Muller), so the coverage test is reproducible. */
function normals(seed: number): () => number {
  let state = seed >>> 0;
  const uniform01 = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform01())) * Math.cos(2 * Math.PI * uniform01());
}

describe('savings uncertainty', () => {
  // If the variance formula is right, the true savings fall inside ±(t·SE) in about `confidence` of simulated
  // worlds. 2,000 worlds: the binomial standard error of the share is ~1 %, so ±4 % is a 4σ band.
  function coverage(form: BaselineModelForm, confidence: number, noiseFor: (days: number) => number): number {
    const draw = normals(form.length * 1000 + Math.round(confidence * 100));
    const trueSavingsPerMonth = 3000;
    const shift = 8; // the reporting year is a little hotter
    // Base use per day for the per-day forms, per period otherwise, so each form is fitted to its own truth.
    const base = (i: number): number => (form.endsWith('-per-day') ? 65 * DAYS[i]! : 2000);
    const expected = (i: number, etoShift: number): number =>
      base(i) + 400 * (ETO[i]! + etoShift) - (form.includes('rain') ? 120 * RAIN[i]! : 0);
    let covered = 0;
    const worlds = 2000;
    for (let w = 0; w < worlds; w++) {
      const baseline = months((i) => expected(i, 0) + noiseFor(DAYS[i]!) * draw());
      const reporting = months((i) => expected(i, shift) - trueSavingsPerMonth + noiseFor(DAYS[i]!) * draw(), shift);
      const savings = calculateSavings(fitBaselineModel(baseline, form), reporting, { confidence });
      if (Math.abs(savings.savedGal - 12 * trueSavingsPerMonth) <= savings.uncertainty.plusMinusGal) covered++;
    }
    return covered / worlds;
  }

  it(
    'when residuals are independent with constant variance, then ' +
      'the 68 % interval covers the truth ~68 % of the time',
    () => {
      const share = coverage('eto-rain', 0.68, () => 1500);
      expect(share).toBeGreaterThan(0.64);
      expect(share).toBeLessThan(0.72);
    },
  );

  it('when the interval is 90 %, then it covers ~90 % of the time', () => {
    const share = coverage('eto', 0.9, () => 1500);
    expect(share).toBeGreaterThan(0.87);
    expect(share).toBeLessThan(0.93);
  });

  it('when daily scatter adds up over each month (variance ∝ days), then the per-day model covers ~68 %', () => {
    const share = coverage('eto-rain-per-day', 0.68, (days) => 280 * Math.sqrt(days));
    expect(share).toBeGreaterThan(0.64);
    expect(share).toBeLessThan(0.72);
  });
});
