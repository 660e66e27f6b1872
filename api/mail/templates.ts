/**
 * Loftline's own mail templates: every message has a plain-text and an HTML part, short and
 * readable. Youth data stays minimal: a child's first name and their own figures only.
 */

/** A rendered message. */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

/** Escapes text for HTML. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function layout(title: string, body: string, footer = ''): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title></head>
<body style="margin:0;background:#F7F5F0;font-family:'Atkinson Hyperlegible',Verdana,sans-serif;color:#1B2A41">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0"><tr><td style="padding:24px">
<table role="presentation" width="100%" style="max-width:560px;margin:auto;background:#ffffff;border-radius:12px;border-top:6px solid #F0A202">
<tr><td style="padding:24px 24px 8px;font-size:20px;font-weight:700">Loftline</td></tr>
<tr><td style="padding:0 24px 24px;font-size:16px;line-height:1.5">${body}</td></tr>
${footer ? `<tr><td style="padding:16px 24px;font-size:13px;color:#4a5568;border-top:1px solid #e2e8f0">${footer}</td></tr>` : ''}
</table></td></tr></table></body></html>`;
}

function button(href: string, label: string): string {
  return `<p><a href="${escapeHtml(href)}" style="display:inline-block;background:#1B2A41;color:#ffffff;padding:12px 20px;border-radius:8px;text-decoration:none;font-weight:700">${escapeHtml(label)}</a></p>`;
}

/** Invitation to set a password (link valid 7 days, once). */
export function inviteMail(v: { name: string; clubName: string; inviter: string; link: string }): RenderedMail {
  const subject = `${v.clubName} invited you to Loftline`;
  const text = `Hello ${v.name},

${v.inviter} at ${v.clubName} has invited you to Loftline, where the club keeps its kicking-drill records.

Choose your password here (the link works once and for 7 days):
${v.link}

If you did not expect this invitation, you can ignore this message.`;
  const html = layout(
    subject,
    `<p>Hello ${escapeHtml(v.name)},</p><p>${escapeHtml(v.inviter)} at ${escapeHtml(v.clubName)} has invited you to Loftline, where the club keeps its kicking-drill records.</p>
${button(v.link, 'Choose your password')}<p style="font-size:14px">The link works once and for 7 days. If you did not expect this invitation, you can ignore this message.</p>`,
  );
  return { subject, text, html };
}

/** Password reset (link valid 1 hour, once). */
export function resetMail(v: { name: string; link: string }): RenderedMail {
  const subject = 'Reset your Loftline password';
  const text = `Hello ${v.name},

Someone asked to reset the password of your Loftline account. To choose a new one, open this link (it works once and for 1 hour):
${v.link}

If it was not you, ignore this message: your password stays as it is.`;
  const html = layout(
    subject,
    `<p>Hello ${escapeHtml(v.name)},</p><p>Someone asked to reset the password of your Loftline account.</p>${button(v.link, 'Choose a new password')}
<p style="font-size:14px">The link works once and for 1 hour. If it was not you, ignore this message: your password stays as it is.</p>`,
  );
  return { subject, text, html };
}

/** The weekly Family digest for one child. */
export function familyDigestMail(v: {
  guardianName: string;
  firstName: string;
  clubName: string;
  /** The week's Monday as the club writes dates. */
  weekLabel: string;
  reps: number;
  /** The share on target as the club writes it ("62 %"), or null with no repetitions on target. */
  hitRate: string | null;
  trend: string;
  highlight: string | null;
  chartCid: string | null;
  unsubscribeLink: string;
}): RenderedMail {
  const subject = `${v.firstName}'s kicking week at ${v.clubName}`;
  const rate = v.hitRate === null ? 'no repetitions on target were logged' : `${v.hitRate} on target`;
  const text = `Hello ${v.guardianName},

${v.firstName}'s week of ${v.weekLabel}: ${v.reps} logged repetitions, ${rate}. ${v.trend}
${v.highlight ? `\nHighlight: ${v.highlight}\n` : ''}
Questions about training load are for the club's coaching and medical staff.

You receive this because you gave consent and opted in. Stop these e-mails: ${v.unsubscribeLink}`;
  const chart = v.chartCid
    ? `<p><img src="cid:${v.chartCid}" width="320" height="120" alt="Repetitions on target per week, last weeks"></p>`
    : '';
  const html = layout(
    subject,
    `<p>Hello ${escapeHtml(v.guardianName)},</p><p><strong>${escapeHtml(v.firstName)}</strong>'s week of ${escapeHtml(v.weekLabel)}: ${v.reps} logged repetitions, ${escapeHtml(rate)}. ${escapeHtml(v.trend)}</p>
${chart}${v.highlight ? `<p>Highlight: ${escapeHtml(v.highlight)}</p>` : ''}<p style="font-size:14px">Questions about training load are for the club's coaching and medical staff.</p>`,
    `You receive this because you gave consent and opted in to the Family digest. <a href="${escapeHtml(v.unsubscribeLink)}">Stop these e-mails</a>.`,
  );
  return { subject, text, html };
}

/** The weekly Squad week summary for a head coach. */
export function squadWeekMail(v: {
  coachName: string;
  weekLabel: string;
  lines: { squadName: string; reps: number; hitRate: string | null; loadFlags: number }[];
  link: string;
}): RenderedMail {
  const subject = `Squad week ${v.weekLabel}`;
  const rows = v.lines.map(
    (l) =>
      `${l.squadName}: ${l.reps} repetitions, ${l.hitRate ?? '—'} on target${l.loadFlags ? `, ${l.loadFlags} kicking-load caution(s)` : ''}`,
  );
  const text = `Hello ${v.coachName},

Your squads in the week of ${v.weekLabel}:
${rows.map((r) => `- ${r}`).join('\n')}

Open Squad week: ${v.link}
Kicking-load cautions are for the club's medical staff to judge.`;
  const html = layout(
    subject,
    `<p>Hello ${escapeHtml(v.coachName)},</p><p>Your squads in the week of ${escapeHtml(v.weekLabel)}:</p><ul>${rows.map((r) => `<li>${escapeHtml(r)}</li>`).join('')}</ul>${button(v.link, 'Open Squad week')}
<p style="font-size:14px">Kicking-load cautions are for the club's medical staff to judge.</p>`,
  );
  return { subject, text, html };
}
