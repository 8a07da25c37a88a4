import type { MailMessage } from './mailer';

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** Wraps paragraphs and one call-to-action link into a plain-text and an HTML part. */
export function compose(to: string, subject: string, paragraphs: string[], link: { label: string; url: string }): MailMessage {
  const text = [...paragraphs, `${link.label}: ${link.url}`, '', '— Falsetrace, the team casebook of measurements that lied'].join('\n\n');
  const html = `<!doctype html><html><body style="font-family:Georgia,serif;color:#1d2a44;background:#f7f3ea;padding:24px">
${paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('\n')}
<p><a href="${escapeHtml(link.url)}" style="color:#0f766e">${escapeHtml(link.label)}</a></p>
<p style="color:#5b6478;font-size:13px">Falsetrace, the team casebook of measurements that lied</p>
</body></html>`;
  return { to, subject, text, html };
}

export function invitationMail(to: string, inviterName: string, role: string, url: string): MailMessage {
  return compose(
    to,
    'You are invited to the Falsetrace casebook',
    [
      `${inviterName} invited you to join Falsetrace as ${role === 'engineer' ? 'an' : 'a'} ${role}.`,
      'Falsetrace is where the team files probing incidents — measurements that lied — so the next person finds the answer first.',
      'The link below works once and expires in 72 hours.',
    ],
    { label: 'Accept the invitation and set your password', url },
  );
}

export function passwordResetMail(to: string, url: string): MailMessage {
  return compose(
    to,
    'Reset your Falsetrace password',
    [
      'Someone asked to reset the password of this Falsetrace account. If it was not you, ignore this mail; nothing changes.',
      'The link below works once and expires in one hour. Setting a new password signs out your other sessions.',
    ],
    { label: 'Choose a new password', url },
  );
}
