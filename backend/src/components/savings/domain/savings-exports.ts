import { toCsv } from '@shared/csv/csv-writer';
import type { SavingsReportDto } from '@shared/savings/savings-project-dto';
import { SAVINGS_CHANGE_LABELS } from '@shared/savings/savings-project-dto';
import { barChart, fmt, heading, muted, newPdf, paragraph, render, table } from '../../../platform/pdf-kit';

type MonthRow = {
  period: 'baseline' | 'reporting';
  month: string;
  days: number;
  etoMm: number;
  rainMm: number;
  actualGal: number | null;
  modelGal: number | null;
  savedGal: number | null;
};

function monthRows(r: SavingsReportDto): MonthRow[] {
  const saved = new Map(r.savings.periods.map((p) => [p.label, p]));
  return [
    ...r.baselineMonths.map((m): MonthRow => ({
      period: 'baseline',
      month: m.month,
      days: m.days,
      etoMm: m.etoMm,
      rainMm: m.rainMm,
      actualGal: m.useGal,
      modelGal: m.fittedGal,
      savedGal: null,
    })),
    ...r.reportingMonths.map((m): MonthRow => ({
      period: 'reporting',
      month: m.month,
      days: m.days,
      etoMm: m.etoMm,
      rainMm: m.rainMm,
      actualGal: m.useGal,
      modelGal: saved.get(m.month)?.predictedGal ?? null,
      savedGal: saved.get(m.month)?.savedGal ?? null,
    })),
  ];
}

const round = (v: number | null, d = 0) => (v === null ? null : Number(v.toFixed(d)));

/** The report's month table: baseline months with the fitted use, reporting months with the predicted baseline. */
export function savingsCsv(r: SavingsReportDto): string {
  return toCsv<MonthRow>(
    [
      { header: 'Site', value: () => r.site.name },
      { header: 'Project', value: () => r.project.title },
      { header: 'Period', value: (m) => m.period },
      { header: 'Month', value: (m) => m.month },
      { header: 'Days', value: (m) => m.days },
      { header: 'ETo (mm)', value: (m) => round(m.etoMm, 1) },
      { header: 'Rain (mm)', value: (m) => round(m.rainMm, 1) },
      { header: 'Metered use (gal)', value: (m) => round(m.actualGal) },
      { header: 'Fitted or predicted baseline (gal)', value: (m) => round(m.modelGal) },
      { header: 'Saved (gal)', value: (m) => round(m.savedGal) },
    ],
    monthRows(r),
    { byteOrderMark: true },
  );
}

export async function savingsPdf(r: SavingsReportDto): Promise<Buffer> {
  const doc = newPdf(`Savings report — ${r.site.name}`);
  doc.font('bold').fontSize(18).text('Weather-normalised savings report');
  paragraph(doc, `${r.site.name} · ${r.project.title}`);
  muted(
    doc,
    `${SAVINGS_CHANGE_LABELS[r.project.changeKind]} installed ${r.project.installedOn} ` +
      `(${r.site.timeZone}). Weather station: ${r.station.name}. ${r.project.changeDescription}`,
  );

  heading(doc, 'Savings');
  const s = r.savings;
  table(
    doc,
    ['Figure', 'Value'],
    [
      ['Predicted baseline use, reporting period', fmt.gal(s.predictedGal)],
      ['Metered use, reporting period', fmt.gal(s.actualGal)],
      ['Water saved', `${fmt.gal(s.savedGal)} (${fmt.pct(s.savedPercent)})`],
      [
        `Uncertainty at ${Math.round(s.uncertainty.confidence * 100)} % confidence`,
        `± ${fmt.gal(s.uncertainty.plusMinusGal)}`,
      ],
      ['Money saved (site rate schedule)', fmt.money(s.savedMoney, s.currency)],
    ],
    [300, 212],
    ['left', 'right'],
  );
  paragraph(doc, r.verdict.summary);

  heading(doc, 'Predicted baseline against metered use, reporting months', 12);
  barChart(
    doc,
    s.periods.map((p) => p.label),
    [
      { name: 'Predicted baseline', color: '#9aa9b3', values: s.periods.map((p) => p.predictedGal) },
      { name: 'Metered use', color: '#2f7d6d', values: s.periods.map((p) => p.actualGal) },
    ],
    'gal',
  );

  heading(doc, 'Baseline model fit (ASHRAE Guideline 14)', 12);
  const st = r.model.statistics;
  const coefficients = r.model.coefficients.map((c) => `${c.term}: ${c.value.toFixed(2)} ${c.unit}`).join('; ');
  paragraph(
    doc,
    `${r.model.equation}. ${coefficients}. ` +
      `R² = ${st.rSquared === null ? '—' : st.rSquared.toFixed(3)} ` +
      `over ${st.n} months.`,
  );
  table(
    doc,
    ['Check', 'Value', 'Threshold', 'Result', 'Source'],
    r.verdict.checks.map((c) => [
      c.label,
      c.value === null ? '—' : `${c.value.toFixed(c.id === 'nmbe' ? 4 : 1)} %`,
      c.limit,
      c.passed ? 'pass' : 'fail',
      c.source,
    ]),
    [150, 70, 70, 45, 177],
    ['left', 'right', 'right', 'left', 'left'],
  );
  muted(doc, `Criteria applied: ${r.verdict.criteria.version}.`);
  for (const w of r.warnings) muted(doc, `Note: ${w}`);

  heading(doc, 'Months', 12);
  table(
    doc,
    ['Period', 'Month', 'ETo', 'Rain', 'Metered', 'Model', 'Saved'],
    monthRows(r).map((m) => [
      m.period,
      m.month,
      fmt.mm(m.etoMm),
      fmt.mm(m.rainMm),
      fmt.gal(m.actualGal),
      fmt.gal(m.modelGal),
      fmt.gal(m.savedGal),
    ]),
    [60, 50, 55, 55, 100, 100, 92],
    ['left', 'left', 'right', 'right', 'right', 'right', 'right'],
  );

  heading(doc, 'Method', 12);
  for (const sentence of r.method) paragraph(doc, sentence);
  return render(doc);
}
