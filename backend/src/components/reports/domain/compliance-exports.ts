import { toCsv } from '@shared/csv/csv-writer';
import type { ComplianceReportDto, ComplianceRowDto } from '@shared/reports/compliance-report-dto';
import { WORKLIST_GROUP_LABELS, WORKLIST_GROUPS } from '@shared/reports/worklist';
import { SITE_KIND_LABELS } from '@shared/sites/site';
import { barChart, fmt, heading, muted, newPdf, paragraph, render, table } from '../../../platform/pdf-kit';

const r1 = (v: number | null) => (v === null ? null : Number(v.toFixed(1)));
const whole = (v: number | null) => (v === null ? null : Math.round(v));

/** The worklist as CSV: every column in words (group, customer type), never codes or slugs. */
export function complianceCsv(report: ComplianceReportDto): string {
  const period = report.month ?? String(report.year);
  return toCsv<ComplianceRowDto>(
    [
      { header: 'Rank', value: (r) => r.rank },
      { header: 'Needs a look', value: (r) => WORKLIST_GROUP_LABELS[r.group] },
      { header: 'Site', value: (r) => r.siteName },
      { header: 'Customer type', value: (r) => SITE_KIND_LABELS[r.siteKind] },
      { header: 'Owner', value: (r) => r.organisationName },
      { header: 'Areas', value: (r) => r.tags.join('; ') },
      { header: `Use ${period} to date (gal)`, value: (r) => Math.round(r.useGal) },
      { header: `Allowance ${period} to date (gal)`, value: (r) => whole(r.budgetGal) },
      { header: 'Share of the period’s ETo to date (%)', value: (r) => r1(r.allowanceShare && 100 * r.allowanceShare) },
      { header: 'Percent of allowance (%)', value: (r) => r1(r.percentOfBudget) },
      { header: `Use ${report.year} to date (gal)`, value: (r) => Math.round(r.annualUseGal) },
      { header: `MAWA ${report.year}, whole year (gal)`, value: (r) => whole(r.annualMawaGal) },
      { header: `MAWA ${report.year} to date (gal)`, value: (r) => whole(r.annualAllowanceGal) },
      { header: 'Percent of MAWA to date (%)', value: (r) => r1(r.annualPercentOfMawa) },
      { header: 'Open alerts', value: (r) => r.openAlerts },
      { header: 'Data completeness (%)', value: (r) => r1(100 * r.completeness) },
      { header: 'Trend vs last year (%)', value: (r) => r1(r.trendPercent) },
      { header: 'Why no budget', value: (r) => r.problem },
      { header: 'Notice sent', value: (r) => r.noticeSentAt?.slice(0, 10) ?? null },
    ],
    report.items,
    { byteOrderMark: true },
  );
}

export async function compliancePdf(report: ComplianceReportDto): Promise<Buffer> {
  const period = report.month ?? String(report.year);
  const doc = newPdf(`Budget worklist ${period}`);
  doc.font('bold').fontSize(18).text(`Budget worklist, ${period}`);
  muted(
    doc,
    `Period ${report.period.from} to ${report.period.to}. ${report.total} sites: ` +
      report.groups
        .filter((g) => g.count)
        .map((g) => `${g.count} ${g.label.toLowerCase()}`)
        .join(', ') +
      '.',
  );
  const over = report.items.filter((r) => r.group === 'over-budget').slice(0, 16);
  if (over.length) {
    heading(doc, 'Over budget: percent of the allowance to date', 12);
    barChart(
      doc,
      over.map((r) => `#${r.rank}`),
      [{ name: 'Percent of allowance to date', color: '#b5573c', values: over.map((r) => r.percentOfBudget) }],
      '%',
    );
  }
  for (const group of WORKLIST_GROUPS) {
    const rows = report.items.filter((r) => r.group === group);
    if (!rows.length) continue;
    heading(doc, WORKLIST_GROUP_LABELS[group], 12);
    table(
      doc,
      ['#', 'Site', 'Type', 'Use', 'Allowance', '% of allow.', 'Alerts', 'Complete', 'Trend'],
      rows.map((r) => [
        String(r.rank),
        `${r.siteName}\n${r.organisationName}`,
        SITE_KIND_LABELS[r.siteKind],
        fmt.gal(r.useGal),
        fmt.gal(r.budgetGal),
        fmt.pct(r.percentOfBudget),
        String(r.openAlerts),
        fmt.pct(100 * r.completeness, 0),
        r.trendPercent === null ? '—' : `${r.trendPercent > 0 ? '+' : ''}${r.trendPercent.toFixed(1)} %`,
      ]),
      [22, 128, 72, 62, 62, 44, 34, 44, 44],
      ['right', 'left', 'left', 'right', 'right', 'right', 'right', 'right', 'right'],
    );
    for (const r of rows.filter((row) => row.problem)) muted(doc, `No budget for ${r.siteName}: ${r.problem}`);
  }
  heading(doc, 'Method', 12);
  paragraph(doc, report.basis);
  paragraph(doc, `Allowance: ${report.allowanceLabel}`);
  paragraph(
    doc,
    'Sites needing a look come first, each in one group: over budget, then incomplete data (under 90 % of the ' +
      'days so far metered), open alerts, no data at all, and no computable budget. Only the rest are ranked ' +
      'as within budget. Data completeness is the share of days so far with metered use; trend compares use ' +
      'with the same months of the previous year.',
  );
  return render(doc);
}
