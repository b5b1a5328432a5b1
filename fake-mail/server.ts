import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type NextFunction, type Request, type Response } from 'express';
import { simpleParser, type AddressObject, type EmailAddress, type HeaderLines } from 'mailparser';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import type { ErrorBody } from '@shared/errors';
import { renderInboxPage, renderMessagePage, renderNotFoundPage } from './pages';
import { MessageFilterSchema, type Message } from './schema';
import { newMessageId, openMailStore, toSummary, type MailStore } from './store';

export interface FakeMailOptions {
  /** Interface both servers bind to; only loopback makes sense for a dev inbox. */
  host?: string;
  /** 0 picks a free port. */
  smtpPort?: number;
  /** 0 picks a free port. */
  httpPort?: number;
  /** Folder holding one JSON file per message; created if missing. */
  dir: string;
}

export interface FakeMail {
  smtpPort: number;
  httpPort: number;
  url: string;
  smtpUrl: string;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

// Headers a test may want to check beyond the ones kept as their own fields.
const HEADERS_OF_INTEREST = new Set([
  'reply-to',
  'list-unsubscribe',
  'list-unsubscribe-post',
  'auto-submitted',
  'precedence',
  'in-reply-to',
  'references',
  'content-language',
]);

// srcdoc frames inherit this policy, so it also keeps e-mail HTML from loading anything off this machine.
const PAGE_CSP = [
  "script-src 'none'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
  "img-src 'self' data: http://127.0.0.1:* http://localhost:*",
].join('; ');

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  const objects = field === undefined ? [] : Array.isArray(field) ? field : [field];
  const out: string[] = [];
  const visit = (list: EmailAddress[]) => {
    for (const entry of list) {
      if (entry.address) out.push(entry.address);
      if (entry.group) visit(entry.group);
    }
  };
  for (const object of objects) visit(object.value);
  return out;
}

function pickHeaders(lines: HeaderLines): Record<string, string> {
  const picked: Record<string, string> = {};
  for (const { key, line } of lines) {
    if (!HEADERS_OF_INTEREST.has(key) && !key.startsWith('x-')) continue;
    const value = line.slice(line.indexOf(':') + 1).replace(/\r?\n[ \t]+/g, ' ').trim();
    picked[key] = picked[key] === undefined ? value : `${picked[key]}, ${value}`;
  }
  return picked;
}

function smtpError(responseCode: number, message: string): Error {
  return Object.assign(new Error(message), { responseCode });
}

async function receive(stream: SMTPServerDataStream, session: SMTPServerSession, store: MailStore) {
  const parsed = await simpleParser(stream, { skipTextToHtml: true });
  if (stream.sizeExceeded) throw smtpError(552, 'Message exceeds the 10 MB limit of the test inbox');

  const receivedAt = new Date().toISOString();
  const headerDate = parsed.date && !Number.isNaN(parsed.date.getTime()) ? parsed.date.toISOString() : null;
  const sender = parsed.from?.value[0];
  const mailFrom = session.envelope.mailFrom;
  const message: Message = {
    id: newMessageId(),
    from: sender?.address ?? (mailFrom ? mailFrom.address : ''),
    fromName: sender?.name || null,
    to: addresses(parsed.to),
    cc: addresses(parsed.cc),
    envelope: {
      from: mailFrom ? mailFrom.address : null,
      to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
    },
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    date: headerDate ?? receivedAt,
    receivedAt,
    messageId: parsed.messageId ?? null,
    headers: pickHeaders(parsed.headerLines),
    attachments: parsed.attachments.map((a) => ({
      filename: a.filename ?? null,
      contentType: a.contentType,
      size: a.size,
      text: a.contentType.startsWith('text/') ? a.content.toString('utf8') : null,
    })),
  };
  await store.add(message);
}

function notFound(res: Response, message: string) {
  res.status(404).json({ error: { code: 'not_found', message } } satisfies ErrorBody);
}

function createApp(store: MailStore) {
  const app = express();
  app.disable('x-powered-by');

  app.get('/api/messages', (req, res) => {
    const filter = MessageFilterSchema.safeParse(req.query);
    if (!filter.success) {
      res.status(400).json({
        error: { code: 'validation_failed', message: 'to and subject must each be given at most once' },
      } satisfies ErrorBody);
      return;
    }
    const items = store.list(filter.data).map(toSummary);
    res.json({ items, page: 1, total: items.length });
  });

  app.get('/api/messages/:id', (req, res) => {
    const message = store.get(req.params.id);
    if (!message) return notFound(res, `No message with id ${req.params.id}`);
    res.json(message);
  });

  app.delete('/api/messages', async (_req, res) => {
    await store.clear();
    res.status(204).end();
  });

  app.use('/api', (req, res) => notFound(res, `No route ${req.method} ${req.originalUrl}`));

  app.use((_req, res, next) => {
    res.set('Content-Security-Policy', PAGE_CSP);
    next();
  });

  app.get('/', (_req, res) => {
    res.type('html').send(renderInboxPage(store.list()));
  });

  app.get('/messages/:id', (req, res) => {
    const message = store.get(req.params.id);
    if (!message) {
      res.status(404).type('html').send(renderNotFoundPage());
      return;
    }
    res.type('html').send(renderMessagePage(message));
  });

  app.post('/clear', async (_req, res) => {
    await store.clear();
    res.redirect(303, '/');
  });

  app.use((err: Error, _req: Request, res: Response, _next: NextFunction) => {
    console.error('[fake-mail] HTTP error:', err);
    res.status(500).json({ error: { code: 'internal', message: err.message } } satisfies ErrorBody);
  });

  return app;
}

function listenHttp(server: Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

function listenSmtp(smtp: SMTPServer, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(port, host, () => {
      smtp.off('error', reject);
      resolve((smtp.server.address() as AddressInfo).port);
    });
  });
}

function closeHttp(server: Server): Promise<void> {
  return new Promise((resolve, reject) => {
    server.close((err) => (err ? reject(err) : resolve()));
    // Keep-alive sockets from fetch would otherwise hold close() open for seconds.
    server.closeAllConnections();
  });
}

function closeSmtp(smtp: SMTPServer): Promise<void> {
  return new Promise((resolve) => smtp.close(() => resolve()));
}

/** Starts the SMTP catcher and its web/JSON viewer over one message folder. */
export async function startFakeMail(opts: FakeMailOptions): Promise<FakeMail> {
  const host = opts.host ?? '127.0.0.1';
  const store = await openMailStore(opts.dir);

  const smtp = new SMTPServer({
    authOptional: true,
    // The app may be configured with credentials; any are accepted, without TLS.
    allowInsecureAuth: true,
    onAuth: (auth, _session, callback) => callback(null, { user: auth.username ?? 'anyone' }),
    disabledCommands: ['STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    disableReverseLookup: true,
    closeTimeout: 1000,
    logger: false,
    banner: 'Tillwell test inbox',
    onData(stream, session, callback) {
      receive(stream, session, store).then(
        () => callback(),
        (err: Error) => {
          // The rest of the message must be drained or the client waits forever for a reply.
          stream.resume();
          callback(err);
        },
      );
    },
  });
  const smtpPort = await listenSmtp(smtp, opts.smtpPort ?? 0, host);
  smtp.on('error', (err) => console.error('[fake-mail] SMTP error:', err.message));

  const http = createServer(createApp(store));
  let httpPort: number;
  try {
    httpPort = await listenHttp(http, opts.httpPort ?? 0, host);
  } catch (err) {
    await closeSmtp(smtp);
    throw err;
  }

  let closing: Promise<void> | undefined;
  return {
    smtpPort,
    httpPort,
    url: `http://${host}:${httpPort}`,
    smtpUrl: `smtp://${host}:${smtpPort}`,
    close() {
      closing ??= Promise.all([closeSmtp(smtp), closeHttp(http)]).then(() => undefined);
      return closing;
    },
  };
}
