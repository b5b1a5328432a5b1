import { formatDate, formatDateTime } from '@shared/dates';
import { roleWords, type Role } from '@shared/schemas/auth';
import type { OutgoingMail } from './mailer';

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

interface Layout {
  to: string;
  subject: string;
  greeting: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  /** Several links side by side (an offer's accept and decline); shown after `action`. */
  actions?: { label: string; url: string }[];
  why: string;
}

/** Renders one e-mail as plain text and simple HTML from the same parts, with a footer saying why it was sent. */
export function renderMail(m: Layout): OutgoingMail {
  const actions = [...(m.action ? [m.action] : []), ...(m.actions ?? [])];
  const text = [
    m.greeting,
    '',
    ...m.paragraphs.flatMap((p) => [p, '']),
    ...actions.flatMap((a) => [`${a.label}: ${a.url}`, '']),
    '-- ',
    `Tillwell. ${m.why}`,
  ].join('\n');
  const html = `<!doctype html><html><body style="margin:0;background:#faf7f0;font-family:'Work Sans',Arial,sans-serif;color:#3d2e26">
<div style="max-width:560px;margin:0 auto;padding:24px">
<p style="font-size:18px;font-weight:600;color:#2f6b3b;margin:0 0 16px">Tillwell</p>
<p>${escape(m.greeting)}</p>
${m.paragraphs.map((p) => `<p style="line-height:1.5">${escape(p)}</p>`).join('\n')}
${actions
  .map(
    (a) => `<p style="margin:24px 0 8px"><a href="${escape(a.url)}" style="background:#2f6b3b;color:#ffffff;padding:12px 20px;border-radius:8px;text-decoration:none;font-weight:600">${escape(a.label)}</a></p>
<p style="font-size:14px;color:#6f695f">Or open this address: <a href="${escape(a.url)}" style="color:#2e6b8c">${escape(a.url)}</a></p>`,
  )
  .join('\n')}
<hr style="border:none;border-top:1px solid #e4dccb;margin:24px 0">
<p style="font-size:13px;color:#6f695f">${escape(m.why)}</p>
</div></body></html>`;
  return { to: m.to, subject: m.subject, text, html };
}

/** The e-mail that invites someone to a club. */
export function inviteMail(p: { to: string; name: string; clubName: string; roles: Role[]; url: string; expiresAt: Date; timeZone: string }) {
  return renderMail({
    to: p.to,
    subject: `You're invited to ${p.clubName} on Tillwell`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `The coordinator of ${p.clubName} has invited you to join as ${roleWords(p.roles)}.`,
      `Follow the link to choose your password. The link works once and expires on ${formatDateTime(p.expiresAt, p.timeZone)}.`,
    ],
    action: { label: 'Accept the invitation', url: p.url },
    why: `You got this because a coordinator of ${p.clubName} entered your address. If you did not expect it, ignore it.`,
  });
}

/** The e-mail with a password reset link. */
export function passwordResetMail(p: { to: string; name: string; url: string; expiresAt: Date; timeZone: string }) {
  return renderMail({
    to: p.to,
    subject: 'Reset your Tillwell password',
    greeting: `Hello ${p.name},`,
    paragraphs: [
      'Someone asked to reset the password of your Tillwell account.',
      `The link works once and expires on ${formatDateTime(p.expiresAt, p.timeZone)}. If it was not you, ignore this e-mail: your password stays as it is.`,
    ],
    action: { label: 'Choose a new password', url: p.url },
    why: 'You got this because a password reset was asked for this address on Tillwell.',
  });
}

/** The renewal e-mail: keep the plot or give it up, before the deadline. */
export function renewalMail(p: {
  to: string;
  name: string;
  clubName: string;
  year: number;
  plotLabel: string;
  siteName: string;
  url: string;
  deadline: Date;
  timeZone: string;
}) {
  return renderMail({
    to: p.to,
    subject: `Keep plot ${p.plotLabel} for ${p.year}? Please answer by ${formatDate(p.deadline, p.timeZone)}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `${p.clubName} is opening the ${p.year} season. You held plot ${p.plotLabel} at ${p.siteName} last season and are in good standing, so it is yours to keep.`,
      `Follow the link to keep it or give it up. If we have no answer by ${formatDateTime(p.deadline, p.timeZone)}, the plot goes to the next person on the waiting list.`,
    ],
    action: { label: 'Keep or give up my plot', url: p.url },
    why: `You got this because you held a plot at ${p.clubName} last season. This message is part of the spring round and cannot be switched off.`,
  });
}

/** The offer e-mail: a free plot for someone on the waiting list, with its deadline and fee. */
export function offerMail(p: {
  to: string;
  name: string;
  clubName: string;
  year: number;
  plotLabel: string;
  siteName: string;
  size: string;
  fee: string;
  /** The offer's link; the e-mail adds `answer=accept` or `answer=decline` to it. */
  url: string;
  deadline: Date;
  timeZone: string;
}) {
  return renderMail({
    to: p.to,
    subject: `A plot for you at ${p.clubName}: ${p.plotLabel} (answer by ${formatDate(p.deadline, p.timeZone)})`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `Good news: plot ${p.plotLabel} at ${p.siteName} (${p.size}) is free for the ${p.year} season and you are next on the waiting list.`,
      `The season's fee would be ${p.fee}.`,
      `Choose a link to accept or decline; each opens a page where you confirm. The offer stays open until ${formatDateTime(p.deadline, p.timeZone)}; after that the plot goes to the next person.`,
    ],
    actions: [
      { label: 'Accept the plot', url: `${p.url}&answer=accept` },
      { label: 'Decline the plot', url: `${p.url}&answer=decline` },
    ],
    why: `You got this because you are on the waiting list of ${p.clubName}.`,
  });
}

/** Sent after an offer is accepted: what is owed, and a link to set a password when the person has none. */
export function welcomeHolderMail(p: {
  to: string;
  name: string;
  clubName: string;
  plotLabel: string;
  siteName: string;
  year: number;
  feeDue: string;
  dueOn: string;
  timeZone: string;
  passwordUrl: string | null;
}) {
  return renderMail({
    to: p.to,
    subject: `Plot ${p.plotLabel} is yours for ${p.year}`,
    greeting: `Hello ${p.name},`,
    paragraphs: [
      `Welcome to ${p.clubName}. Plot ${p.plotLabel} at ${p.siteName} is yours for the ${p.year} season.`,
      `Your fee of ${p.feeDue} is due by ${formatDate(p.dueOn, p.timeZone)}. The coordinator will tell you how to pay.`,
      ...(p.passwordUrl ? ['To see your plot and your fee on Tillwell, choose a password for your account.'] : []),
    ],
    action: p.passwordUrl ? { label: 'Choose my password', url: p.passwordUrl } : undefined,
    why: `You got this because you accepted a plot offer from ${p.clubName}.`,
  });
}
