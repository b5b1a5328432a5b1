import type { OutgoingMail } from './mailer';
import { MailLayout, P, renderMail, type StopLink } from './layout';

/** The coordinator's text as paragraphs: blank lines separate them, single line breaks stay as spaces. */
export function paragraphsOf(body: string): string[] {
  return body
    .replace(/\r\n?/g, '\n')
    .split(/\n\s*\n/)
    .map((p) => p.replace(/\s*\n\s*/g, ' ').trim())
    .filter((p) => p !== '');
}

interface ClubNewsProps {
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
  /** The person's own stop link for club news (optional mail). */
  stop: StopLink;
}

export function ClubNewsEmail(p: ClubNewsProps) {
  const paragraphs = paragraphsOf(p.body);
  return (
    <MailLayout
      preview={paragraphs[0] ?? p.subject}
      greeting={`Hello ${p.name},`}
      why={`You got this because ${p.because}. It is club news, which you can turn off. Messages about your own plot (offers, renewals, receipts) are always sent.`}
      choices={{ label: 'Change your e-mail choices', url: p.preferencesUrl }}
      stop={p.stop}
    >
      {paragraphs.map((text, i) => (
        <P key={i}>{text}</P>
      ))}
      <P>{`${p.senderName}, coordinator of ${p.clubName}`}</P>
    </MailLayout>
  );
}

/** One club message to one person, with a footer saying why they got it, where to change their e-mail choices and how to stop club news. */
export function clubNewsMail(p: ClubNewsProps): Promise<OutgoingMail> {
  return renderMail(p.to, p.subject, <ClubNewsEmail {...p} />, p.stop);
}
