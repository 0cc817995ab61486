import { KIND_LABELS, SUB_KIND_LABELS, type AlertEventDto, type AlertSummaryDto } from '@shared/alerts/alert-dto';
import type { MonthCloseRowDto } from '@shared/month-close/month-close-dto';
import { totalsOf } from '@shared/month-close/month-figures';
import { barChart, heading, muted, newPdf, paragraph, render, table, type Pdf } from '../../../platform/pdf-kit';
import type { ReportFormat } from '../../../platform/report-format';

export type PacketAlert = AlertSummaryDto & { events: AlertEventDto[] };

export interface PacketSite {
  row: MonthCloseRowDto;
  days: { date: string; useGallons: number | null; budgetGallons: number | null }[];
  alerts: PacketAlert[];
}

export interface PacketContent {
  title: string;
  organisationName: string;
  month: string;
  preparedBy: string;
  preparedOn: string;
  format: ReportFormat;
  sites: PacketSite[];
}

const STATUS_WORDS: Record<string, string> = { open: 'Open', acknowledged: 'Being handled', resolved: 'Resolved' };
const ACTION_WORDS: Record<string, string> = {
  acknowledged: 'took it on',
  resolved: 'marked it resolved',
  note: 'noted',
  reopened: 'reopened it',
  updated: 'updated it',
};

/**
 * A board packet for an HOA or any owner: one portfolio page (every site's month in one table), then one page per
 * site with its daily use against budget, the month's alerts and what was done about them.
 */
export async function boardPacketPdf(content: PacketContent): Promise<Buffer> {
  const doc = newPdf(`${content.title} — ${content.format.month(content.month)}`);
  portfolioPage(doc, content);
  for (const site of content.sites) {
    doc.addPage();
    sitePage(doc, site, content);
  }
  return render(doc);
}

function portfolioPage(doc: Pdf, c: PacketContent): void {
  const f = c.format;
  doc.font('bold').fontSize(18).text(c.title);
  paragraph(doc, `${c.organisationName} · ${f.month(c.month)}`);
  muted(doc, `Prepared by ${c.preparedBy} on ${f.date(c.preparedOn)}.`);
  const rows = c.sites.map((s) => s.row);
  const t = totalsOf(rows);
  const reviewed = rows.filter((r) => r.review).length;
  heading(doc, 'The month at a glance', 13);
  paragraph(
    doc,
    `${rows.length} sites used ${f.volume(t.useGallons)}` +
      (t.budgetGallons === null
        ? ' (not every site has a water budget, so no total budget is given).'
        : ` against a water budget of ${f.volume(t.budgetGallons)}.`) +
      (t.percentOfBudget === null
        ? ''
        : ` The ${t.comparedSites} sites with readings used ${f.percent(t.percentOfBudget)} of their budget.`) +
      ` Water cost ${f.money(t.cost, t.currency)}. ${t.openAlerts} alerts still open; ` +
      `${reviewed} of ${rows.length} sites reviewed by management.`,
  );
  heading(doc, 'Sites', 13);
  table(
    doc,
    ['Site', 'Use', 'Budget', 'Over (+) / under', '% of budget', 'Cost', 'Open alerts', 'Metered days', 'Reviewed'],
    rows.map((r) => [
      r.siteName,
      f.volume(r.useGallons),
      f.volume(r.budgetGallons),
      r.varianceGallons === null ? '—' : `${r.varianceGallons > 0 ? '+' : ''}${f.volume(r.varianceGallons)}`,
      f.percent(r.percentOfBudget),
      f.money(r.cost, r.currency),
      `${r.openAlerts} of ${r.alertsInMonth}`,
      `${r.meteredDays} of ${r.expectedDays}`,
      r.review ? 'yes' : 'no',
    ]),
    [104, 60, 60, 62, 42, 54, 42, 46, 42],
    ['left', 'right', 'right', 'right', 'right', 'right', 'right', 'right', 'left'],
  );
  heading(doc, 'How to read this packet', 11);
  muted(
    doc,
    'Use is what the dedicated irrigation meters recorded on each site’s own calendar. The water budget is what ' +
      'the planted areas needed that month (each hydrozone’s area and plant factor against reference ' +
      'evapotranspiration, ETo, from the site’s weather station). A month with missing meter days reads low: ' +
      '“Days metered” says how complete each site’s data is.',
  );
}

function sitePage(doc: Pdf, site: PacketSite, c: PacketContent): void {
  const f = c.format;
  const r = site.row;
  doc.font('bold').fontSize(16).text(r.siteName);
  muted(doc, `${f.month(c.month)} · times and days on the site’s clock (${r.timeZone})`);
  table(
    doc,
    ['Metered use', 'Water budget', 'Over (+) / under', 'Water cost', 'Days metered'],
    [
      [
        f.volume(r.useGallons),
        r.budgetGallons === null ? 'none' : f.volume(r.budgetGallons),
        r.varianceGallons === null
          ? '—'
          : `${r.varianceGallons > 0 ? '+' : ''}${f.volume(r.varianceGallons)} (${f.percent(r.percentOfBudget)})`,
        f.money(r.cost, r.currency),
        `${r.meteredDays} of ${r.expectedDays}`,
      ],
    ],
    [100, 130, 110, 82, 90],
    ['right', 'right', 'right', 'right', 'right'],
  );
  if (r.budgetGallons === null) muted(doc, `No water budget: ${r.budgetProblem ?? 'it could not be computed.'}`);
  heading(doc, 'Daily use against the daily budget', 11);
  if (site.days.every((d) => d.useGallons === null)) {
    paragraph(doc, 'No meter readings for this month: upload the meter’s data for this site to see its daily use.');
  } else {
    doc.moveDown(1);
    barChart(
      doc,
      site.days.map((d) => String(Number(d.date.slice(8)))),
      [
        { name: 'Metered use', color: '#2f7d6d', values: site.days.map((d) => value(f, d.useGallons)) },
        { name: 'Daily budget', color: '#9aa9b3', values: site.days.map((d) => value(f, d.budgetGallons)) },
      ],
      f.volumeUnit,
    );
  }
  heading(doc, 'Alerts this month', 11);
  if (!site.alerts.length) paragraph(doc, 'No alerts this month.');
  else
    table(
      doc,
      ['Alert', 'When', 'Status', 'Water lost'],
      site.alerts.map((a) => [
        alertName(a),
        `${f.date(a.periodStartUtc, a.timeZone)} – ${f.date(a.periodEndUtc, a.timeZone)}`,
        STATUS_WORDS[a.status] ?? a.status,
        f.volume(a.waterLostGal),
      ]),
      [210, 140, 80, 82],
      ['left', 'left', 'left', 'right'],
    );
  heading(doc, 'What was done', 11);
  const done = whatWasDone(site, f);
  if (!done.length) paragraph(doc, 'Nothing recorded yet.');
  for (const line of done) paragraph(doc, `• ${line}`);
}

function value(f: ReportFormat, gallons: number | null): number | null {
  return gallons === null ? null : f.volumeValue(gallons);
}

function alertName(a: AlertSummaryDto): string {
  const kind = KIND_LABELS[a.kind] ?? a.kind;
  const sub = SUB_KIND_LABELS[a.subKind];
  return `${kind}${sub ? ` — ${sub}` : ''}${a.zoneName ? ` (${a.zoneName})` : ''}`;
}

/** People's actions on the month's alerts, then the manager's review note. */
function whatWasDone(site: PacketSite, f: ReportFormat): string[] {
  const lines: string[] = [];
  for (const a of site.alerts)
    for (const e of a.events.filter((ev) => ev.userId !== null && ACTION_WORDS[ev.action])) {
      const note = e.note ? `: “${e.note}”` : '';
      lines.push(`${f.date(e.at, a.timeZone)} — ${e.userName} ${ACTION_WORDS[e.action]} (${alertName(a)})${note}`);
    }
  const review = site.row.review;
  if (review)
    lines.push(
      `${f.date(review.reviewedAt, site.row.timeZone)} — ${review.reviewedBy} reviewed the month` +
        (review.note ? `: “${review.note}”` : '.'),
    );
  return lines;
}
