/** Plain-text and HTML bodies of the product's e-mails. Every interpolated value is escaped in HTML. */
export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

export function escapeHtml(text: string): string {
  return text.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );
}

function layout(
  title: string,
  paragraphs: string[],
  action: { label: string; url: string },
  footer: string,
): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 16px">${escapeHtml(p)}</p>`).join('\n');
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>
<body style="font-family:'Open Sans',Arial,sans-serif;color:#1d2b2a;line-height:1.5;padding:24px">
<h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(title)}</h1>
${body}
<p style="margin:24px 0"><a href="${escapeHtml(action.url)}" style="background:#0f5c57;color:#ffffff;padding:10px 18px;border-radius:4px;text-decoration:none">${escapeHtml(action.label)}</a></p>
<p style="margin:0 0 16px;font-size:13px">If the button does not work, open this address: <a href="${escapeHtml(action.url)}">${escapeHtml(action.url)}</a></p>
<p style="margin:24px 0 0;font-size:12px;color:#5a6b69">${escapeHtml(footer)}</p>
</body></html>`;
}

export function invitationMail(p: {
  displayName: string;
  organisationName: string;
  invitedBy: string;
  link: string;
  validDays: number;
}): MailContent {
  const subject = `You are invited to Rotaplex at ${p.organisationName}`;
  const lines = [
    `Hello ${p.displayName},`,
    `${p.invitedBy} has invited you to Rotaplex, where ${p.organisationName} plans its rosters.`,
    `Choose your password to activate your account. The link works once and expires in ${p.validDays} days.`,
  ];
  const footer = 'If you did not expect this invitation, you can ignore this message.';
  return {
    subject,
    text: `${lines.join('\n\n')}\n\n${p.link}\n\n${footer}\n`,
    html: layout(subject, lines, { label: 'Set your password', url: p.link }, footer),
  };
}

export function passwordResetMail(p: {
  displayName: string;
  link: string;
  validMinutes: number;
}): MailContent {
  const subject = 'Reset your Rotaplex password';
  const lines = [
    `Hello ${p.displayName},`,
    `Someone (hopefully you) asked to reset your Rotaplex password. The link works once and expires in ${p.validMinutes} minutes.`,
  ];
  const footer = 'If you did not ask for this, ignore this message: your password stays as it is.';
  return {
    subject,
    text: `${lines.join('\n\n')}\n\n${p.link}\n\n${footer}\n`,
    html: layout(subject, lines, { label: 'Choose a new password', url: p.link }, footer),
  };
}
