import nodemailer from 'nodemailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Extra headers, kept with the message in the outbox. */
  headers?: Record<string, string>;
  /** The sender's display name (the address stays the configured one), e.g. a coordinator's name and club. */
  fromName?: string | null;
  /** Files sent with it, e.g. a shift's calendar entry (text/calendar). */
  attachments?: MailAttachment[] | null;
}

export interface MailAttachment {
  filename: string;
  contentType: string;
  content: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** Builds the SMTP mailer; smtp:// URLs to loopback (the fake inbox) skip STARTTLS. */
export function createMailer(smtpUrl: string, from: string): Mailer {
  const url = new URL(smtpUrl);
  const local = url.hostname === '127.0.0.1' || url.hostname === 'localhost';
  const transport = nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 587)),
    secure: url.protocol === 'smtps:',
    ignoreTLS: local && url.protocol === 'smtp:',
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    // A server that does not answer counts as a failed try (retried later) instead of holding the sender for minutes.
    connectionTimeout: 20_000,
    greetingTimeout: 20_000,
    socketTimeout: 60_000,
  });
  return {
    async send({ fromName, attachments, ...mail }) {
      // Only the display name changes: the address stays ours, so the mail still passes the domain's checks.
      const address = /<([^>]+)>\s*$/.exec(from)?.[1] ?? from;
      await transport.sendMail({ from: fromName ? { name: fromName, address } : from, ...mail, ...(attachments?.length ? { attachments } : {}) });
    },
    close() {
      transport.close();
    },
  };
}
