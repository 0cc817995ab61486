/** The words of watch e-mail: a nightly digest and a single-alert message, each as text and HTML. */
import { KIND_LABELS, SEVERITY_LABELS, SUB_KIND_LABELS } from '@shared/alerts/alert-dto';
import type { FindingKind, Severity } from '@shared/watch/finding';

/** A run's note about a site whose checks were skipped or weakened. */
export interface MailWarning {
  siteId: number;
  siteName: string;
  message: string;
  /** A site not set up for the check yet (no hydrozones or station): shown on the run page, not mailed. */
  setupOnly?: boolean;
}

export interface MailAlert {
  id: number;
  siteName: string;
  timeZone: string;
  kind: FindingKind;
  subKind: string;
  severity: Severity;
  periodStartUtc: Date;
  waterLostGal: number | null;
  moneyLost: number | null;
  currency: string | null;
  explanation: string;
  reopened: boolean;
}

const esc = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function localDate(at: Date, zone: string): string {
  return (
    new Intl.DateTimeFormat('en-US', { timeZone: zone, dateStyle: 'medium', timeStyle: 'short' }).format(at) +
    ` (${zone})`
  );
}

function lossText(a: MailAlert): string {
  const water =
    a.waterLostGal === null
      ? 'water lost: not measurable'
      : `about ${Math.round(a.waterLostGal).toLocaleString('en-US')} gal lost so far`;
  const money = a.moneyLost === null ? '' : `, about ${a.moneyLost.toFixed(2)} ${a.currency ?? ''}`.trimEnd();
  return water + money;
}

function headline(a: MailAlert): string {
  return (
    `${a.reopened ? 'Back again: ' : ''}${KIND_LABELS[a.kind]} — ` +
    `${SUB_KIND_LABELS[a.subKind] ?? a.subKind} at ${a.siteName}`
  );
}

const CAUTION =
  'Before digging or working on valves, follow local codes and call a licensed professional where the work needs one.';

export function digestMail(d: {
  to: string;
  name: string;
  alerts: MailAlert[];
  warnings: MailWarning[];
  baseUrl: string;
}): { to: string; subject: string; text: string; html: string } {
  const { to, name, alerts, warnings, baseUrl } = d;
  const subject =
    alerts.length > 0
      ? `Rillmark nightly watch: ${alerts.length} new alert${alerts.length === 1 ? '' : 's'}`
      : 'Rillmark nightly watch: checks limited by missing data';
  const lines = alerts.map(
    (a) =>
      `- ${headline(a)} [${SEVERITY_LABELS[a.severity]}]\n  since ${localDate(a.periodStartUtc, a.timeZone)}; ` +
      `${lossText(a)}\n  ${a.explanation}\n  ${baseUrl}/alerts/${a.id}`,
  );
  const found = alerts.length > 0 ? `Last night's watch found:\n\n${lines.join('\n\n')}\n\n` : '';
  const noted = warnings.map((w) => `- ${w.siteName}: ${w.message}`).join('\n');
  const text =
    `Hello ${name},\n\n${found}` +
    (warnings.length ? `What the watch could not check fully:\n${noted}\n\n` : '') +
    `${CAUTION}\n\nChange what you receive: ${baseUrl}/alerts/notifications\n`;
  const items = alerts
    .map(
      (a) =>
        `<li><p><strong>${esc(headline(a))}</strong> — ${esc(SEVERITY_LABELS[a.severity])}<br>since ` +
        `${esc(localDate(a.periodStartUtc, a.timeZone))}; ${esc(lossText(a))}</p>` +
        `<p>${esc(a.explanation)}</p><p><a href="${esc(`${baseUrl}/alerts/${a.id}`)}">Open the alert</a></p></li>`,
    )
    .join('');
  const warningItems = warnings.map((w) => `<li>${esc(w.siteName)}: ${esc(w.message)}</li>`).join('');
  const html =
    `<p>Hello ${esc(name)},</p>` +
    (alerts.length ? `<p>Last night's watch found:</p><ul>${items}</ul>` : '') +
    (warnings.length ? `<p>What the watch could not check fully:</p><ul>${warningItems}</ul>` : '') +
    `<p><em>${esc(CAUTION)}</em></p>` +
    `<p><a href="${esc(`${baseUrl}/alerts/notifications`)}">Change what you receive</a></p>`;
  return { to, subject, text, html };
}

export function singleAlertMail(
  to: string,
  name: string,
  a: MailAlert,
  baseUrl: string,
): { to: string; subject: string; text: string; html: string } {
  const subject = `Rillmark alert: ${headline(a)}`;
  const text =
    `Hello ${name},\n\n${headline(a)} [${SEVERITY_LABELS[a.severity]}]\nsince ` +
    `${localDate(a.periodStartUtc, a.timeZone)}; ${lossText(a)}\n\n${a.explanation}\n\n` +
    `${baseUrl}/alerts/${a.id}\n\n${CAUTION}\n`;
  const html =
    `<p>Hello ${esc(name)},</p><p><strong>${esc(headline(a))}</strong> ` +
    `— ${esc(SEVERITY_LABELS[a.severity])}<br>since ${esc(localDate(a.periodStartUtc, a.timeZone))}; ` +
    `${esc(lossText(a))}</p>` +
    `<p>${esc(a.explanation)}</p><p><a href="${esc(`${baseUrl}/alerts/${a.id}`)}">Open ` +
    `the alert</a></p><p><em>${esc(CAUTION)}</em></p>`;
  return { to, subject, text, html };
}
