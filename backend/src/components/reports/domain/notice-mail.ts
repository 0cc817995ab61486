import type { OutgoingMail } from '../../../platform/mail/mailer';
import type { Principal } from '../../../platform/auth/principal';
import type { NoticeRecipient } from '../data/compliance-notices-repository';

const esc = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const gal = (v: number) => `${Math.round(v).toLocaleString('en-US')} gal`;

/** The templated budget notice: figures with units, the sender's note, and a link to the site's budget page. */
export function noticeMail(n: {
  to: NoticeRecipient;
  siteName: string;
  siteId: number;
  month: string;
  useGal: number;
  budgetGal: number | null;
  percent: number | null;
  message: string;
  sender: Principal;
  publicUrl: string;
}): OutgoingMail {
  const standing =
    n.percent === null
      ? `used ${gal(n.useGal)} in ${n.month}; its water budget for the month could not be computed`
      : `used ${gal(n.useGal)} in ${n.month}, ${n.percent.toFixed(0)} % of its water budget of ${gal(n.budgetGal!)}`;
  const link = `${n.publicUrl}/sites/${n.siteId}/budget`;
  const lines = [
    `Hello ${n.to.displayName},`,
    '',
    `${n.siteName} ${standing}.`,
    ...(n.message ? ['', 'Note from the sender:', n.message] : []),
    '',
    `Review the site's budget and use: ${link}`,
    '',
    'This notice was sent through Rillmark; one notice is sent per site and month.',
  ];
  return {
    to: n.to.email,
    subject: `Water budget notice: ${n.siteName}, ${n.month}`,
    text: lines.join('\n'),
    html:
      `<p>Hello ${esc(n.to.displayName)},</p><p><strong>${esc(n.siteName)}</strong> ${esc(standing)}.</p>` +
      (n.message
        ? `<p>Note from the sender:</p><blockquote>${esc(n.message).replace(/\n/g, '<br>')}</blockquote>`
        : '') +
      `<p><a href="${esc(link)}">Review the site's budget and use</a></p><p ` +
      'style="color:#5b6770">This notice was sent through Rillmark; ' +
      'one notice is sent per site and month.</p>',
  };
}
