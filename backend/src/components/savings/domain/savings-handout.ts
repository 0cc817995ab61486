import { criteriaCitation } from '@shared/savings/acceptance-criteria';
import { SAVINGS_CHANGE_LABELS, type SavingsReportDto } from '@shared/savings/savings-project-dto';
import { barChart, heading, muted, newPdf, paragraph, render, table, type Pdf } from '../../../platform/pdf-kit';
import type { ReportFormat } from '../../../platform/report-format';

/**
 * The one-page handout a contractor gives a client: what was done, the retrofit list, cost and simple payback, the
 * chart, the acceptance checks with the standard and the criteria version, and the method of the model actually
 * fitted. No provenance notes: those stay in the code and its tests.
 */
export async function savingsHandoutPdf(r: SavingsReportDto, f: ReportFormat, preparedOn: string): Promise<Buffer> {
  const doc = newPdf(`${r.project.title} — savings handout`);
  const p = r.project;
  doc.font('bold').fontSize(17).text(p.title);
  paragraph(doc, `${r.site.name} · ${p.ownerName}`);
  muted(
    doc,
    `Prepared by ${p.createdByOrganisation ?? p.createdByName ?? 'the project team'} on ${f.date(preparedOn)}.`,
  );

  heading(doc, 'What was done', 11.5);
  paragraph(
    doc,
    `${SAVINGS_CHANGE_LABELS[p.changeKind]}, installed ${f.date(p.installedOn)}.` +
      (p.changeDescription ? ` ${p.changeDescription}` : ''),
  );
  if (p.retrofits.length) for (const line of p.retrofits) paragraph(doc, `• ${line}`);

  results(doc, r, f);
  heading(doc, 'Expected use without the change, against metered use', 11.5);
  doc.moveDown(0.8);
  const s = r.savings;
  barChart(
    doc,
    s.periods.map((m) => f.monthShort(m.label)),
    [
      {
        name: 'Expected without the change',
        color: '#9aa9b3',
        values: s.periods.map((m) => f.volumeValue(m.predictedGal)),
      },
      { name: 'Metered', color: '#2f7d6d', values: s.periods.map((m) => f.volumeValue(m.actualGal)) },
    ],
    f.volumeUnit,
    105,
  );
  checks(doc, r);
  heading(doc, 'How the savings were measured', 11.5);
  for (const sentence of r.method) muted(doc, sentence);
  return render(doc);
}

function results(doc: Pdf, r: SavingsReportDto, f: ReportFormat): void {
  const s = r.savings;
  const p = r.project;
  heading(doc, `Results, ${f.month(p.reportingFrom)} to ${f.month(lastReported(r))}`, 11.5);
  table(
    doc,
    ['Water saved', 'Share of expected use', 'Money saved', 'Installed cost', 'Simple payback'],
    [
      [
        `${f.volume(s.savedGal)} (± ${f.volume(s.uncertainty.plusMinusGal)})`,
        f.percent(s.savedPercent, 1),
        s.annualMoney === null
          ? f.money(s.savedMoney, s.currency)
          : `${f.money(s.savedMoney, s.currency)} (${f.money(s.annualMoney, s.currency)} a year)`,
        f.money(p.installedCost, p.costCurrency ?? s.currency),
        s.paybackYears === null ? '—' : `${s.paybackYears.toFixed(1)} years`,
      ],
    ],
    [132, 82, 126, 82, 90],
    ['right', 'right', 'right', 'right', 'right'],
  );
  muted(doc, `The ± range is at ${Math.round(s.uncertainty.confidence * 100)} % confidence. ${r.verdict.summary}`);
}

function checks(doc: Pdf, r: SavingsReportDto): void {
  heading(doc, 'Acceptance checks', 11.5);
  muted(doc, `Judged against ${criteriaCitation()}.`);
  table(
    doc,
    ['Check', 'Value', 'Limit', 'Result'],
    r.verdict.checks.map((c) => [
      c.label,
      c.value === null ? '—' : `${c.value.toFixed(c.id === 'nmbe' ? 4 : 1)} %`,
      c.limit,
      c.passed ? 'pass' : 'not met',
    ]),
    [250, 90, 100, 72],
    ['left', 'right', 'right', 'left'],
  );
}

function lastReported(r: SavingsReportDto): string {
  return r.savings.periods[r.savings.periods.length - 1]?.label ?? r.project.reportingTo;
}
