// Outgoing messages, each with a text and an HTML body (pure).
import { ROLE_LABELS, type Role } from '@/lib/auth/permissions';
import type { StampDecision } from '@/lib/review/words';

export type Mail = { subject: string; text: string; html: string };

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

function wrap(
  title: string,
  paragraphs: string[],
  link: { href: string; label: string },
  footer: string,
  footerLink?: { href: string; label: string },
): string {
  return `<!doctype html><html><body style="font-family:system-ui,sans-serif;background:#f7f2e8;color:#2a2a2d;padding:24px">
<div style="max-width:520px;margin:auto;background:#fff;border:1px solid #ded3bd;border-radius:8px;padding:24px">
<h1 style="font-size:20px;margin:0 0 12px">${esc(title)}</h1>
${paragraphs.map((p) => `<p style="line-height:1.5">${esc(p)}</p>`).join('\n')}
<p><a href="${esc(link.href)}" style="display:inline-block;background:#1d4e6e;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none;font-weight:bold">${esc(link.label)}</a></p>
<p style="font-size:12px;color:#77767d">${esc(footer)}${footerLink ? ` <a href="${esc(footerLink.href)}" style="color:#1d4e6e">${esc(footerLink.label)}</a>` : ''}</p>
</div></body></html>`;
}

/**
 * Where these e-mails are turned off: the setting is the person's own (one for every series) and sits under
 * Notifications on a series' Members page, which `settings` links to.
 */
const SETTINGS_FOOTER = 'To stop mention and stamp e-mails, untick them under Notifications on the Members page of the series:';
const footerText = (settings: string) => `${SETTINGS_FOOTER} ${settings}`;
const footerLink = (settings: string) => ({ href: settings, label: 'Members → Notifications' });

/** `forAddress`: the only account that may accept (null for a link anyone may use). */
export function invitationMail(p: {
  seriesTitle: string;
  inviter: string;
  role: Role;
  link: string;
  expiresAt: Date;
  forAddress?: string | null;
}): Mail {
  const until = p.expiresAt.toISOString().slice(0, 10);
  const subject = `${p.inviter} invites you to “${p.seriesTitle}” on Quadrille`;
  const lines = [
    `${p.inviter} invites you to join the series “${p.seriesTitle}” as ${ROLE_LABELS[p.role].toLowerCase()}.`,
    p.forAddress
      ? `The link works once and until ${until}, for the account with this address (${p.forAddress}): sign in with it, or create an account with it.`
      : `The link works once and until ${until}. You will be asked to sign in or create an account.`,
  ];
  return {
    subject,
    text: `${lines.join('\n\n')}\n\nAccept the invitation: ${p.link}\n`,
    html: wrap(
      subject,
      lines,
      { href: p.link, label: 'Accept the invitation' },
      'If you did not expect this, ignore it: nothing happens unless the link is used.',
    ),
  };
}

export function mentionMail(p: { author: string; gagTitle: string; excerpt: string; link: string; settings: string }): Mail {
  const subject = `${p.author} mentioned you on “${p.gagTitle}”`;
  const lines = [`${p.author} wrote on “${p.gagTitle}”:`, `“${p.excerpt}”`];
  return {
    subject,
    text: `${lines.join('\n\n')}\n\nOpen the gag: ${p.link}\n\n${footerText(p.settings)}\n`,
    html: wrap(subject, lines, { href: p.link, label: 'Open the gag' }, SETTINGS_FOOTER, footerLink(p.settings)),
  };
}

export function stampMail(p: {
  editor: string;
  gagTitle: string;
  passNumber: number;
  decision: StampDecision;
  note: string;
  link: string;
  settings: string;
}): Mail {
  const verdict = p.decision === 'ready' ? 'is ready to ink' : 'needs another pass';
  const subject = `“${p.gagTitle}” ${verdict}`;
  const lines = [`${p.editor} stamped pass ${p.passNumber} of “${p.gagTitle}”: ${verdict}.`, ...(p.note ? [`Note: ${p.note}`] : [])];
  return {
    subject,
    text: `${lines.join('\n\n')}\n\nOpen the gag: ${p.link}\n\n${footerText(p.settings)}\n`,
    html: wrap(subject, lines, { href: p.link, label: 'Open the gag' }, SETTINGS_FOOTER, footerLink(p.settings)),
  };
}
