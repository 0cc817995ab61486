import { describe, expect, it } from 'vitest';
import { fitBaselineModel, type BaselineModel, type MeteredPeriod } from './baseline-model';
import { calculateSavings } from './savings-calculation';
import { cvRmseLimitFor, judgeSavings } from './savings-verdict';

// Invented monthly weather (mm); use = 2,000 + 400·ETo − 120·rain plus scaled zero-sum noise.
const DAYS = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
const ETO = [50, 65, 95, 125, 155, 175, 190, 170, 130, 90, 60, 45];
const RAIN = [90, 80, 60, 25, 8, 1, 0, 0, 5, 20, 50, 85];
const NOISE = [900, -1200, 400, -300, 1500, -800, -600, 1100, -700, 200, -900, 400];
const truth = (i: number): number => 2000 + 400 * ETO[i]! - 120 * RAIN[i]!;

function months(use: (i: number) => number, count = 12): MeteredPeriod[] {
  return DAYS.slice(0, count).map((days, i) => ({
    label: `M${i + 1}`,
    days,
    etoMm: ETO[i]!,
    rainMm: RAIN[i]!,
    useGal: use(i),
  }));
}

const fit = (noiseScale: number, count = 12): BaselineModel =>
  fitBaselineModel(
    months((i) => truth(i) + noiseScale * NOISE[i]!, count),
    'eto-rain',
  );
const reportingAt = (share: number): MeteredPeriod[] => months((i) => share * truth(i));

describe('Guideline 14 verdict', () => {
  it('when the fit is tight and savings are 30 %, then savings can be claimed on the prescriptive route', () => {
    const model = fit(1);
    const verdict = judgeSavings(model, calculateSavings(model, reportingAt(0.7)));
    expect(verdict.baselineModelAcceptable).toBe(true);
    expect(verdict.canClaimSavings).toBe(true);
    expect(verdict.route).toBe('prescriptive');
    expect(verdict.reasons).toEqual([]);
    expect(verdict.summary).toMatch(/meets Guideline 14 \(CV\(RMSE\) \d\.\d %, NMBE 0\.0000 %\)/);
    expect(verdict.checks.every((c) => c.fromMemory)).toBe(true);
  });

  it('when the baseline scatters (CV(RMSE) above 25 %) and savings are small, then it says plainly why not', () => {
    const model = fit(12);
    expect(model.statistics.cvRmsePercent).toBeGreaterThan(25); // guard: the invented noise really is that large
    const verdict = judgeSavings(model, calculateSavings(model, reportingAt(0.95), {}));
    expect(verdict.canClaimSavings).toBe(false);
    expect(verdict.baselineModelAcceptable).toBe(false);
    expect(verdict.checks.find((c) => c.id === 'cv-rmse')!.passed).toBe(false);
    expect(verdict.summary).toMatch(
      /^The baseline model is not good enough to claim savings because its CV\(RMSE\) is \d+\.\d %, above the 25 % Guideline 14 allows with 12 to 60 months/,
    );
    expect(verdict.reasons.join(' ')).toMatch(/uncertain by ±\d+ % of their size at 68 % confidence/);
  });

  it(
    'when CV(RMSE) fails but the savings are large and certain, then ' + 'the uncertainty route still allows the claim',
    () => {
      const model = fit(12);
      const verdict = judgeSavings(model, calculateSavings(model, reportingAt(0.3)));
      expect(verdict.baselineModelAcceptable).toBe(false);
      expect(verdict.route).toBe('uncertainty');
      expect(verdict.canClaimSavings).toBe(true);
      expect(verdict.summary).toMatch(
        /uncertainty route.*although the baseline's CV\(RMSE\) of \d+\.\d % is above the 25 %/,
      );
    },
  );

  it('when savings were computed at 90 % confidence, then the uncertainty check is still judged at 68 %', () => {
    const model = fit(12);
    const at68 = judgeSavings(model, calculateSavings(model, reportingAt(0.6)));
    const at90 = judgeSavings(model, calculateSavings(model, reportingAt(0.6), { confidence: 0.9 }));
    const value = (v: typeof at68): number => v.checks.find((c) => c.id === 'savings-uncertainty')!.value!;
    expect(value(at90)).toBeCloseTo(value(at68), 9);
    expect(at90.route).toBe(at68.route);
  });

  it('when the model is biased (NMBE outside ±0.005 %), then no route is open', () => {
    const model = fit(1);
    const biased: BaselineModel = { ...model, statistics: { ...model.statistics, nmbePercent: 0.8 } };
    const verdict = judgeSavings(biased, calculateSavings(model, reportingAt(0.5)));
    expect(verdict.canClaimSavings).toBe(false);
    expect(verdict.reasons.join(' ')).toMatch(/NMBE is 0\.8000 %.*biased/);
  });

  it('when savings are only 5 % with a good model, then the prescriptive route is closed by the 10 % rule', () => {
    const model = fit(1);
    const verdict = judgeSavings(model, calculateSavings(model, reportingAt(0.95)));
    expect(verdict.checks.find((c) => c.id === 'savings-share')!.passed).toBe(false);
    expect(verdict.route === 'prescriptive').toBe(false);
  });

  it(
    'when savings are 1 % with a good model, then it says the model ' +
      'is fine but the savings are too small to stand out',
    () => {
      const model = fit(1);
      const verdict = judgeSavings(model, calculateSavings(model, reportingAt(0.99)));
      expect(verdict.baselineModelAcceptable).toBe(true);
      expect(verdict.canClaimSavings).toBe(false);
      expect(verdict.summary).toMatch(
        /^The baseline model meets Guideline 14, but the savings cannot be claimed because the savings \(1\.0 %\) are not above 10 %.*uncertain by ±\d+ %/,
      );
    },
  );

  it('when use went up, then there are no savings to claim', () => {
    const model = fit(1);
    const verdict = judgeSavings(model, calculateSavings(model, reportingAt(1.2)));
    expect(verdict.canClaimSavings).toBe(false);
    expect(verdict.summary).toMatch(/^No savings to claim: the site used [\d,]+ gal more/);
  });

  it('when the baseline has only 8 months, then it warns that IPMVP expects about a year', () => {
    const model = fit(1, 8);
    const verdict = judgeSavings(model, calculateSavings(model, reportingAt(0.7).slice(0, 8)));
    expect(verdict.warnings.join(' ')).toMatch(/baseline covers 243 days .*about 12 months/);
    expect(judgeSavings(fit(1), calculateSavings(fit(1), reportingAt(0.7))).warnings.join(' ')).not.toMatch(
      /baseline covers/,
    );
  });

  it('when residuals trend month to month, then it warns the uncertainty is understated', () => {
    const drifting = fitBaselineModel(
      months((i) => truth(i) + 300 * (i < 6 ? i : 11 - i)),
      'eto',
    );
    expect(drifting.residualLagOneAutocorrelation!).toBeGreaterThan(0.5); // guard on the invented drift
    const verdict = judgeSavings(drifting, calculateSavings(drifting, reportingAt(0.7)));
    expect(verdict.warnings.join(' ')).toMatch(/residuals are correlated/);
  });
});

describe('CV(RMSE) limit by reporting length (G14-2002 §5.2.11, from memory)', () => {
  it('when under 12 months 20 %, 12 to 60 months 25 %, beyond 60 months 30 %', () => {
    expect(cvRmseLimitFor(300).maxPercent).toBe(20);
    expect(cvRmseLimitFor(334).maxPercent).toBe(20); // 11 months
    expect(cvRmseLimitFor(360).maxPercent).toBe(25); // twelve short bills still make a year
    expect(cvRmseLimitFor(365).maxPercent).toBe(25);
    expect(cvRmseLimitFor(5 * 365).maxPercent).toBe(25);
    expect(cvRmseLimitFor(1826).maxPercent).toBe(25); // 60 months
    expect(cvRmseLimitFor(1857).maxPercent).toBe(30); // 61 months
  });
});
