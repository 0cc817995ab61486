import { ROLE_LABELS, type Role } from '@shared/auth/roles';
import type { OutgoingMail } from '../../../platform/mail/mailer';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const BUTTON_STYLE = 'background:#0f5e6b;color:#fff;padding:10px 18px;border-radius:6px;text-decoration:none';
const LINK_HINT = 'If the button does not work, paste this address into your browser:';

function layout(title: string, paragraphs: string[], action: { label: string; link: string }): string {
  return `<!doctype html><html><body style="font-family:'Open Sans',Arial,sans-serif;color:#17323a;max-width:560px">
<h2 style="color:#0f5e6b">${escape(title)}</h2>
${paragraphs.map((p) => `<p>${escape(p)}</p>`).join('\n')}
<p><a href="${escape(action.link)}" style="${BUTTON_STYLE}">${escape(action.label)}</a></p>
<p style="font-size:12px;color:#5b7077">${LINK_HINT}<br>${escape(action.link)}</p>
</body></html>`;
}

export function invitationMail(p: {
  to: string;
  displayName: string;
  invitedBy: string;
  organisation: string;
  role: Role;
  link: string;
  existingAccount: boolean;
  publicUrl: string;
}): OutgoingMail {
  const intro = `${p.invitedBy} has invited you to ${p.organisation} on Rillmark as ${ROLE_LABELS[p.role]}.`;
  if (p.existingAccount) {
    const lines = [
      `Hello ${p.displayName},`,
      intro,
      'You already have a Rillmark account: sign in as usual and choose this organisation.',
    ];
    return {
      to: p.to,
      subject: `You now have access to ${p.organisation} on Rillmark`,
      text: [...lines, p.publicUrl].join('\n\n'),
      html: layout('Rillmark access', lines, { label: 'Sign in', link: p.publicUrl }),
    };
  }
  const lines = [
    `Hello ${p.displayName},`,
    intro,
    'Choose a password to activate your account. The link works once and expires in 3 days.',
  ];
  return {
    to: p.to,
    subject: `Invitation to ${p.organisation} on Rillmark`,
    text: [...lines, p.link].join('\n\n'),
    html: layout('You are invited to Rillmark', lines, { label: 'Choose a password', link: p.link }),
  };
}

export function passwordResetMail(p: {
  to: string;
  displayName: string;
  requestedBy: string;
  link: string;
  publicUrl: string;
}): OutgoingMail {
  const lines = [
    `Hello ${p.displayName},`,
    `${p.requestedBy} asked Rillmark to let you choose a new password.`,
    'The link works once and expires in 3 days. If you did not expect ' +
      'this, you can ignore this message; your password stays as it is.',
  ];
  return {
    to: p.to,
    subject: 'Choose a new Rillmark password',
    text: [...lines, p.link].join('\n\n'),
    html: layout('Choose a new password', lines, { label: 'Choose a new password', link: p.link }),
  };
}
