import { toCsv } from '@shared/csv/csv-writer';
import type { ComplianceReportDto, ComplianceRowDto } from '@shared/reports/compliance-report-dto';
import { barChart, fmt, heading, muted, newPdf, paragraph, render, table } from '../../../platform/pdf-kit';

const r1 = (v: number | null) => (v === null ? null : Number(v.toFixed(1)));

export function complianceCsv(report: ComplianceReportDto): string {
  return toCsv<ComplianceRowDto>(
    [
      { header: 'Rank', value: (r) => r.rank },
      { header: 'Site', value: (r) => r.siteName },
      { header: 'Customer type', value: (r) => r.siteKind },
      { header: 'Owner', value: (r) => r.organisationName },
      { header: 'Areas', value: (r) => r.tags.join('; ') },
      { header: `Use ${report.month ?? report.year} (gal)`, value: (r) => Math.round(r.useGal) },
      {
        header: `Budget ${report.month ?? report.year} (gal)`,
        value: (r) => (r.budgetGal === null ? null : Math.round(r.budgetGal)),
      },
      { header: 'Percent of budget (%)', value: (r) => r1(r.percentOfBudget) },
      { header: `Use ${report.year} (gal)`, value: (r) => Math.round(r.annualUseGal) },
      {
        header: `MAWA ${report.year} (gal)`,
        value: (r) => (r.annualMawaGal === null ? null : Math.round(r.annualMawaGal)),
      },
      { header: 'Percent of MAWA (%)', value: (r) => r1(r.annualPercentOfMawa) },
      { header: 'Data completeness (%)', value: (r) => r1(100 * r.completeness) },
      { header: 'Trend vs last year (%)', value: (r) => r1(r.trendPercent) },
      { header: 'Problem', value: (r) => r.problem },
      { header: 'Notice sent', value: (r) => r.noticeSentAt },
    ],
    report.items,
    { byteOrderMark: true },
  );
}

export async function compliancePdf(report: ComplianceReportDto): Promise<Buffer> {
  const doc = newPdf(`Budget compliance ${report.month ?? report.year}`);
  doc
    .font('bold')
    .fontSize(18)
    .text(`Budget compliance, ${report.month ?? report.year}`);
  const firstRank = report.page * report.pageSize + 1;
  muted(
    doc,
    `Period ${report.period.from} to ${report.period.to}. ${report.total} ` +
      `sites; this page lists ranks ${firstRank}–${firstRank + report.items.length - 1}.`,
  );
  heading(doc, 'Percent of budget', 12);
  const top = report.items.slice(0, 16);
  barChart(
    doc,
    top.map((r) => `#${r.rank}`),
    [{ name: 'Percent of budget', color: '#b5573c', values: top.map((r) => r.percentOfBudget) }],
    '%',
  );
  heading(doc, 'Ranking', 12);
  table(
    doc,
    ['#', 'Site', 'Type', 'Use', 'Budget', '% of budget', 'Complete', 'Trend'],
    report.items.map((r) => [
      String(r.rank),
      r.siteName,
      r.siteKind,
      fmt.gal(r.useGal),
      fmt.gal(r.budgetGal),
      fmt.pct(r.percentOfBudget),
      fmt.pct(100 * r.completeness, 0),
      r.trendPercent === null ? '—' : `${r.trendPercent > 0 ? '+' : ''}${r.trendPercent.toFixed(1)} %`,
    ]),
    [22, 140, 70, 70, 70, 50, 45, 45],
    ['right', 'left', 'left', 'right', 'right', 'right', 'right', 'right'],
  );
  for (const r of report.items.filter((row) => row.problem)) muted(doc, `No budget for ${r.siteName}: ${r.problem}`);
  heading(doc, 'Method', 12);
  paragraph(doc, report.basis);
  paragraph(
    doc,
    'Sites are ranked by percent of budget, highest first; sites ' +
      'without a computable budget come last. Data completeness is ' +
      'the share of days so far in the period with metered use; trend ' +
      'compares use with the same months of the previous year.',
  );
  return render(doc);
}
