import type { PlanComparisonDto, PlanDto } from '@shared/planner/plan-dto';
import { barChart, fmt, heading, muted, newPdf, paragraph, render, table } from '../../../platform/pdf-kit';

const area = (v: number) => `${Math.round(v).toLocaleString('en-US')} ft²`;
const etaf = (v: number | null) => (v === null ? '—' : v.toFixed(2));
const signed = (v: number) => `${v > 0 ? '−' : v < 0 ? '+' : ''}${Math.abs(Math.round(v)).toLocaleString('en-US')}`;

/** The side-by-side comparison a manager hands to a board: allowance, estimated use, money and payback. */
export async function planPdf(plan: PlanDto, c: PlanComparisonDto): Promise<Buffer> {
  const doc = newPdf(`What-if plan — ${c.siteName}`);
  doc.font('bold').fontSize(18).text('What-if plan: before and after');
  paragraph(doc, `${c.siteName} · ${plan.title}`);
  if (plan.notes) muted(doc, plan.notes);
  muted(
    doc,
    `Weather year ${c.weather.year} (${c.weather.stationName}): ETo ${c.weather.etoIn.toFixed(1)} in, ` +
      `rain ${c.weather.rainIn.toFixed(1)} in. Allowed ETAF ${c.allowedEtaf} — ${c.allowedEtafSource}.`,
  );

  heading(doc, 'Summary per year', 12);
  const money = (v: number | null) => fmt.money(v, c.currency);
  table(
    doc,
    ['', 'Today', 'With the plan', 'Change'],
    [
      ['Irrigated landscape', area(c.before.landscapeAreaFt2), area(c.after.landscapeAreaFt2), '—'],
      [
        'Allowance (MAWA)',
        fmt.gal(c.before.mawaGal),
        fmt.gal(c.after.mawaGal),
        signed(c.before.mawaGal - c.after.mawaGal),
      ],
      ['Estimated use (ETWU)', fmt.gal(c.before.estimatedUseGal), fmt.gal(c.after.estimatedUseGal), signed(c.savedGal)],
      ['Site-wide ETAF', etaf(c.before.sitewideEtaf), etaf(c.after.sitewideEtaf), '—'],
      ['Water cost (site rates)', money(c.before.annualCost), money(c.after.annualCost), money(c.savedMoney)],
    ],
    [150, 120, 120, 122],
    ['left', 'right', 'right', 'right'],
  );
  const share = c.savedPercent === null ? '' : ` (${c.savedPercent.toFixed(1)} %)`;
  const payback = c.paybackYears === null ? 'not worked out' : `${c.paybackYears.toFixed(1)} years`;
  paragraph(
    doc,
    [
      `Water saved: ${fmt.gal(c.savedGal)} a year${share}.`,
      `Money saved: ${money(c.savedMoney)} a year.`,
      `Cost of the work: ${fmt.money(c.costOfWork, plan.currency)}.`,
      `Simple payback: ${payback}.`,
    ].join(' '),
  );
  barChart(
    doc,
    ['Allowance', 'Estimated use'],
    [
      { name: 'Today', color: '#9aa9b3', values: [c.before.mawaGal, c.before.estimatedUseGal] },
      { name: 'With the plan', color: '#2f7d6d', values: [c.after.mawaGal, c.after.estimatedUseGal] },
    ],
    'gal/yr',
  );

  heading(doc, 'Hydrozones', 12);
  table(
    doc,
    ['Hydrozone', 'Change', 'ETAF today', 'ETAF after', 'Use today', 'Use after'],
    c.zones.map((z) => [
      z.name,
      // The embedded Latin subset has no arrow.
      z.changes.join('; ').replaceAll('→', 'to') || 'unchanged',
      etaf(z.before.etaf),
      z.after.areaFt2 > 0 ? etaf(z.after.etaf) : '—',
      fmt.gal(z.before.etwuGal),
      fmt.gal(z.after.etwuGal),
    ]),
    [95, 147, 55, 55, 80, 80],
    ['left', 'left', 'right', 'right', 'right', 'right'],
  );

  heading(doc, 'Assumptions', 12);
  for (const a of c.assumptions) paragraph(doc, `• ${a}`);
  heading(doc, 'Cautions', 12);
  for (const a of c.cautions) paragraph(doc, `• ${a}`);
  heading(doc, 'Method', 12);
  for (const m of c.method) muted(doc, m);
  return render(doc);
}
