import { FAULT_LABELS, HEAD_TYPE_LABELS, type FieldAuditDto } from '@shared/field-audits/field-audit-dto';
import { fmt, heading, muted, newPdf, paragraph, render, table, type Pdf } from '../../../platform/pdf-kit';

/** Photo bytes by photo id, JPEG or PNG only (what pdfkit can embed). */
export type PhotoBytes = Map<number, Buffer>;

const num = (v: number | null | undefined, d: number) => (v === null || v === undefined ? '—' : v.toFixed(d));

/** The audit report a contractor or auditor hands over: results per zone, run times, faults with photos. */
export async function fieldAuditPdf(a: FieldAuditDto, photos: PhotoBytes): Promise<Buffer> {
  const doc = newPdf(`Irrigation audit — ${a.siteName}`);
  doc.font('bold').fontSize(18).text('Irrigation audit report');
  paragraph(doc, `${a.siteName} · ${a.title}`);
  const by = a.createdByName ? `${a.organisationName} (${a.createdByName})` : a.organisationName;
  const pressure = a.staticPressurePsi === null ? 'not recorded' : `${a.staticPressurePsi} psi`;
  muted(
    doc,
    [
      `Audited ${a.auditedOn} by ${by}. Status: ${a.status}.`,
      `Static pressure at the point of connection: ${pressure}.`,
      `Run times for ${a.scheduleMonth}, ${a.daysPerWeek} watering days a week.`,
    ].join(' '),
  );
  if (a.notes) paragraph(doc, a.notes);
  zoneResults(doc, a);
  runTimes(doc, a);
  faults(doc, a, photos);
  heading(doc, 'Cautions', 12);
  for (const c of a.cautions) paragraph(doc, `• ${c}`);
  heading(doc, 'Method', 12);
  for (const m of a.method) muted(doc, m);
  return render(doc);
}

function zoneResults(doc: Pdf, a: FieldAuditDto): void {
  heading(doc, 'Catch-can results', 12);
  if (!a.zoneTests.length) return muted(doc, 'No zone was tested.');
  table(
    doc,
    ['Hydrozone', 'Heads', 'Cans', 'Run', 'Rate', 'DU_lq', 'SM', 'Rating', 'Pressures'],
    a.zoneTests.map((t) => [
      t.hydrozoneName,
      HEAD_TYPE_LABELS[t.headType],
      String(t.catches.length),
      `${t.runMinutes} min`,
      t.results ? `${t.results.prInPerHour.toFixed(2)} in/h` : '—',
      t.results ? fmt.pct(100 * t.results.du, 0) : '—',
      num(t.results?.schedulingMultiplier, 2),
      t.results ? `${t.results.rating} (target ${Math.round(100 * t.results.duTarget)} %)` : (t.problem ?? '—'),
      t.pressures.map((p) => `${p.location}: ${p.psi} psi`).join('; ') || '—',
    ]),
    [80, 52, 30, 36, 50, 38, 30, 80, 116],
    ['left', 'left', 'right', 'right', 'right', 'right', 'right', 'left', 'left'],
  );
  for (const t of a.zoneTests) for (const w of t.results?.warnings ?? []) muted(doc, `${t.hydrozoneName}: ${w}`);
}

function runTimes(doc: Pdf, a: FieldAuditDto): void {
  heading(doc, `Run times the budget allows (${a.scheduleMonth})`, 12);
  const scheduled = a.zoneTests.filter((t) => t.schedule);
  if (!scheduled.length) return muted(doc, a.zoneTests.find((t) => t.problem)?.problem ?? 'No run times yet.');
  table(
    doc,
    ['Hydrozone', 'Need /wk', 'Budget /wk', 'Per day', 'Cycles', 'Soil & slope'],
    scheduled.map((t) => {
      const s = t.schedule!;
      return [
        t.hydrozoneName,
        `${s.neededMinutesPerWeek.toFixed(0)} min`,
        `${s.budgetMinutesPerWeek.toFixed(0)} min${s.budgetCoversNeed ? '' : ' (short)'}`,
        `${s.minutesPerWateringDay.toFixed(0)} min`,
        s.cycleSoak ? `${s.cycleSoak.cycles} × ${s.cycleSoak.minutesPerCycle.toFixed(1)} min` : 'one run',
        s.effectiveIntakeInPerHour === null
          ? 'intake not entered'
          : `${s.effectiveIntakeInPerHour.toFixed(2)} in/h${s.slopeLabel ? `, slope ${s.slopeLabel}` : ''}`,
      ];
    }),
    [110, 70, 85, 60, 80, 107],
    ['left', 'right', 'right', 'right', 'right', 'left'],
  );
  const cautions = new Set(scheduled.flatMap((t) => t.schedule!.cautions));
  for (const c of cautions) muted(doc, c);
}

function faults(doc: Pdf, a: FieldAuditDto, photos: PhotoBytes): void {
  heading(doc, 'Faults found', 12);
  if (!a.faults.length) return muted(doc, 'No faults recorded.');
  table(
    doc,
    ['Fault', 'Where', 'Status', 'Notes', 'Photos'],
    a.faults.map((f) => [FAULT_LABELS[f.kind], f.location, f.status, f.description, String(f.photos.length)]),
    [100, 120, 45, 200, 47],
    ['left', 'left', 'left', 'left', 'right'],
  );
  for (const f of a.faults) {
    const embeddable = f.photos.filter((p) => photos.has(p.id)).slice(0, 3);
    if (!embeddable.length) continue;
    if (doc.y + 140 > doc.page.height - doc.page.margins.bottom) doc.addPage();
    muted(doc, `${FAULT_LABELS[f.kind]}, ${f.location}:`);
    const top = doc.y;
    embeddable.forEach((p, i) => {
      doc.image(photos.get(p.id)!, doc.page.margins.left + i * 170, top, { fit: [160, 120] });
    });
    doc.x = doc.page.margins.left;
    doc.y = top + 126;
  }
}
