import { criteriaCitation } from '@shared/savings/acceptance-criteria';
import { SAVINGS_CHANGE_LABELS, type SavingsReportDto } from '@shared/savings/savings-project-dto';
import { barChart, heading, muted, newPdf, paragraph, render, table, type Pdf } from '../../../platform/pdf-kit';
import type { ReportFormat } from '../../../platform/report-format';

/** The retrofit list ends above this line (points from the top), so the handout stays on one page. */
const RETROFITS_END_Y = 240;

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
    fitted(
      doc,
      `${SAVINGS_CHANGE_LABELS[p.changeKind]}, installed ${f.date(p.installedOn)}.` +
        (p.changeDescription ? ` ${p.changeDescription}` : ''),
      RETROFITS_END_Y - 20,
    ),
  );
  retrofitList(doc, p.retrofits);
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
    80,
  );
  checks(doc, r);
  heading(doc, 'How the savings were measured', 11.5);
  muted(doc, r.method.join(' '));
  return render(doc);
}

/** The text, shortened at a word with "…" until it ends above `maxY` (a long description keeps the one page). */
function fitted(doc: Pdf, text: string, maxY: number): string {
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  doc.font('body').fontSize(10);
  let shown = text;
  while (shown.length > 40 && doc.y + doc.heightOfString(shown, { width }) > maxY)
    shown = `${shown.slice(0, Math.floor(shown.length * 0.9)).replace(/\s+\S*$/, '')}…`;
  return shown;
}

/** As many retrofit lines as fit; the rest are counted, and listed on the project's page. */
function retrofitList(doc: Pdf, lines: string[]): void {
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  let shown = 0;
  for (const line of lines) {
    const height = doc.font('body').fontSize(10).heightOfString(`• ${line}`, { width });
    if (doc.y + height > RETROFITS_END_Y) break;
    paragraph(doc, `• ${line}`);
    shown++;
  }
  if (shown < lines.length) muted(doc, `… and ${lines.length - shown} more items, listed on the project.`);
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
