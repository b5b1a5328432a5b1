import { renderMail } from './templates';
import type { OutgoingMail } from './mailer';

const escape = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The coordinator's text as paragraphs: blank lines separate them, single line breaks stay as spaces. */
export function paragraphsOf(body: string): string[] {
  return body
    .replace(/\r\n?/g, '\n')
    .split(/\n\s*\n/)
    .map((p) => p.replace(/\s*\n\s*/g, ' ').trim())
    .filter((p) => p !== '');
}

/** One club message to one person, with a footer saying why they got it and where to change their e-mail choices. */
export function clubNewsMail(p: {
  to: string;
  name: string;
  clubName: string;
  /** The coordinator who sends it; the message is signed with their name. */
  senderName: string;
  subject: string;
  body: string;
  /** Why this person is in the audience, e.g. "you hold a plot at Mossgate in 2027". */
  because: string;
  preferencesUrl: string;
}): OutgoingMail {
  const mail = renderMail({
    to: p.to,
    subject: p.subject,
    greeting: `Hello ${p.name},`,
    paragraphs: [...paragraphsOf(p.body), `${p.senderName}, coordinator of ${p.clubName}`],
    why: `You got this because ${p.because}. It is club news, which you can turn off: change your e-mail choices at ${p.preferencesUrl}. Messages about your own plot (offers, renewals, receipts) are always sent.`,
  });
  // renderMail writes the footer as text; make the address of the e-mail choices a link in the HTML part.
  const shown = escape(p.preferencesUrl);
  const at = mail.html.lastIndexOf(shown);
  const html =
    at < 0
      ? mail.html
      : `${mail.html.slice(0, at)}<a href="${shown}" style="color:#2e6b8c">${shown}</a>${mail.html.slice(at + shown.length)}`;
  return { ...mail, html };
}
