import { mkdtemp, readdir, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createTransport } from 'nodemailer';
import type Mail from 'nodemailer/lib/mailer';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '@shared/errors';
import { clearMail, extractLink, getMail, listMail, waitForMail } from '../tests/helpers/inbox';
import { MessageListSchema } from './schema';
import { startFakeMail, type FakeMail } from './server';

const SCRIPT_SUBJECT = '<script>alert(1)</script>';
const CONFIRM_URL = 'http://127.0.0.1:5173/plots/12/confirm?token=a1&next=%2Fbook';

async function send(port: number, message: Mail.Options) {
  const transport = createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
  try {
    return await transport.sendMail(message);
  } finally {
    transport.close();
  }
}

async function jsonFiles(dir: string) {
  return (await readdir(dir)).filter((name) => name.endsWith('.json'));
}

describe('fake mail server', () => {
  let dir: string;
  let mail: FakeMail;
  let plotMessageId = '';

  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'tillwell-fake-mail-'));
    // A folder that does not exist yet, to prove it gets created.
    dir = path.join(dir, 'mail');
    mail = await startFakeMail({ smtpPort: 0, httpPort: 0, dir });
  });

  afterAll(async () => {
    await mail?.close();
    await rm(path.dirname(dir), { recursive: true, force: true });
  });

  it('listens on loopback and reports both URLs', () => {
    expect(mail.smtpPort).toBeGreaterThan(0);
    expect(mail.httpPort).toBeGreaterThan(0);
    expect(mail.url).toBe(`http://127.0.0.1:${mail.httpPort}`);
    expect(mail.smtpUrl).toBe(`smtp://127.0.0.1:${mail.smtpPort}`);
  });

  it('stores each message sent over SMTP as a file and lists them newest first', async () => {
    const plot = await send(mail.smtpPort, {
      from: '"Tillwell" <no-reply@tillwell.test>',
      // Nodemailer lowercases the domain on the way out; the local part keeps its case.
      to: 'Ann Weaver <Ann@Example.org>',
      bcc: 'cara@example.org',
      replyTo: 'office@tillwell.test',
      subject: 'Your plot is ready',
      text: `Hello Ann,\nConfirm here: ${CONFIRM_URL}.\nThanks`,
      html: `<p>Confirm <a href="${CONFIRM_URL.replace('&', '&amp;')}">here</a></p>`,
      headers: { 'X-Tillwell-Kind': 'plot-offer' },
    });
    await send(mail.smtpPort, {
      from: 'no-reply@tillwell.test',
      to: 'bob@example.org',
      subject: SCRIPT_SUBJECT,
      text: 'Plain only',
    });

    const res = await fetch(`${mail.url}/api/messages`);
    expect(res.status).toBe(200);
    const list = MessageListSchema.parse(await res.json());
    expect(list.total).toBe(2);
    expect(list.page).toBe(1);
    expect(list.items.map((m) => m.subject)).toEqual([SCRIPT_SUBJECT, 'Your plot is ready']);
    expect(list.items[0]!.id > list.items[1]!.id).toBe(true);
    expect(await jsonFiles(dir)).toHaveLength(2);

    plotMessageId = list.items[1]!.id;
    const full = await getMail(mail.url, plotMessageId);
    expect(full).toMatchObject({
      from: 'no-reply@tillwell.test',
      fromName: 'Tillwell',
      to: ['Ann@example.org'],
      subject: 'Your plot is ready',
      messageId: plot.messageId,
      envelope: { from: 'no-reply@tillwell.test', to: ['Ann@example.org', 'cara@example.org'] },
    });
    expect(full.text).toContain(CONFIRM_URL);
    expect(full.html).toContain('href="http://127.0.0.1:5173/plots/12/confirm?token=a1&amp;next=%2Fbook"');
    expect(full.headers['reply-to']).toContain('office@tillwell.test');
    expect(full.headers['x-tillwell-kind']).toBe('plot-offer');
    expect(Number.isNaN(Date.parse(full.date))).toBe(false);

    const plain = await getMail(mail.url, list.items[0]!.id);
    expect(plain.html).toBeNull();
    expect(plain.text.trim()).toBe('Plain only');
  });

  it('filters by recipient (To or envelope, any case) and by subject substring', async () => {
    expect((await listMail(mail.url, { to: 'ann@EXAMPLE.org' })).map((m) => m.subject)).toEqual(['Your plot is ready']);
    expect((await listMail(mail.url, { to: 'CARA@example.org' })).map((m) => m.subject)).toEqual(['Your plot is ready']);
    expect(await listMail(mail.url, { to: 'ann@example' })).toEqual([]);
    expect((await listMail(mail.url, { subject: 'PLOT IS' })).map((m) => m.to)).toEqual([['Ann@example.org']]);
    expect((await listMail(mail.url, { subject: 'script' })).map((m) => m.to)).toEqual([['bob@example.org']]);

    const res = await fetch(`${mail.url}/api/messages?to=bob@example.org&subject=nothing-like-this`);
    expect(MessageListSchema.parse(await res.json()).total).toBe(0);
  });

  it('answers 404 with the error body for an unknown id', async () => {
    const res = await fetch(`${mail.url}/api/messages/000000000000000000`);
    expect(res.status).toBe(404);
    const body = ErrorBodySchema.parse(await res.json());
    expect(body.error.code).toBe('not_found');
    expect(body.error.message).toContain('000000000000000000');
  });

  it('escapes subjects on the inbox page and links each message', async () => {
    const res = await fetch(`${mail.url}/`);
    expect(res.headers.get('content-type')).toMatch(/^text\/html/);
    expect(res.headers.get('content-security-policy')).toContain("script-src 'none'");
    const html = await res.text();
    expect(html).toContain('<title>Tillwell test inbox</title>');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).not.toContain('<script');
    expect(html).toContain(`href="/messages/${plotMessageId}"`);
    expect(html).toContain('<form method="post" action="/clear">');
    // Newest first: the second message sent comes before the first.
    expect(html.indexOf('&lt;script&gt;')).toBeLessThan(html.indexOf('Your plot is ready'));
  });

  it('shows a message with autolinked text and the HTML in a script-free sandbox', async () => {
    const res = await fetch(`${mail.url}/messages/${plotMessageId}`);
    expect(res.status).toBe(200);
    const html = await res.text();
    const escapedUrl = 'http://127.0.0.1:5173/plots/12/confirm?token=a1&amp;next=%2Fbook';
    // The full stop after the URL belongs to the sentence, not to the link.
    expect(html).toContain(`<a href="${escapedUrl}" target="_blank" rel="noopener noreferrer">${escapedUrl}</a>.`);

    const iframe = /<iframe\b[^>]*>/.exec(html)?.[0] ?? '';
    const sandbox = /\ssandbox="([^"]*)"/.exec(iframe)?.[1];
    expect(sandbox).toBeDefined();
    expect(sandbox).not.toContain('allow-scripts');
    expect(sandbox).not.toContain('allow-same-origin');
    // The body's own &amp; is escaped once more inside the attribute.
    expect(iframe).toContain('srcdoc="&lt;base target=&quot;_blank&quot;&gt;&lt;p&gt;Confirm &lt;a href=&quot;');
    expect(iframe).toContain('token=a1&amp;amp;next');

    const missing = await fetch(`${mail.url}/messages/000000000000000000`);
    expect(missing.status).toBe(404);
    expect(await missing.text()).toContain('No such message');
  });

  it('waitForMail polls until a matching message arrives, and extractLink finds its link', async () => {
    const after = Date.now();
    const sending = new Promise<void>((resolve, reject) => {
      setTimeout(() => {
        send(mail.smtpPort, {
          from: 'no-reply@tillwell.test',
          to: 'dee@example.org',
          subject: 'Your watering shift tomorrow',
          html: '<p><a href="http://127.0.0.1:5173/shifts/7?from=mail&amp;week=3">See the shift</a></p>',
        }).then(() => resolve(), reject);
      }, 250);
    });
    const message = await waitForMail(mail.url, { to: 'dee@example.org', subject: 'shift', after, timeoutMs: 5000 });
    await sending;
    expect(message.subject).toBe('Your watering shift tomorrow');
    expect(extractLink(message, '/shifts/')).toBe('http://127.0.0.1:5173/shifts/7?from=mail&week=3');

    const plot = await getMail(mail.url, plotMessageId);
    expect(extractLink(plot, '/confirm')).toBe(CONFIRM_URL);
    expect(() => extractLink(plot, '/reset-password')).toThrow(/no link whose path contains "\/reset-password".*Confirm here:/s);
  });

  it('waitForMail times out with a clear error when nothing matches', async () => {
    const started = Date.now();
    await expect(waitForMail(mail.url, { to: 'nobody@example.org', timeoutMs: 300 })).rejects.toThrow(
      /no message to nobody@example\.org arrived within 300 ms .*Latest in the inbox:/s,
    );
    const elapsed = Date.now() - started;
    expect(elapsed).toBeGreaterThanOrEqual(300);
    expect(elapsed).toBeLessThan(3000);

    // A message that was already there before `after` does not count.
    await expect(
      waitForMail(mail.url, { to: 'ann@example.org', after: Date.now() + 1, timeoutMs: 300 }),
    ).rejects.toThrow(/no message to ann@example\.org received since .* within 300 ms/);
  });

  it('refuses a message over the 10 MB limit and keeps nothing of it', async () => {
    const before = (await listMail(mail.url)).length;
    await expect(
      send(mail.smtpPort, {
        from: 'no-reply@tillwell.test',
        to: 'big@example.org',
        subject: 'Too big',
        text: 'x'.repeat(11 * 1024 * 1024),
      }),
    ).rejects.toMatchObject({ responseCode: 552 });
    expect(await listMail(mail.url, { to: 'big@example.org' })).toEqual([]);
    expect(await listMail(mail.url)).toHaveLength(before);
  });

  it('keeps messages across a restart on the same folder', async () => {
    const before = await listMail(mail.url);
    const plotBefore = await getMail(mail.url, plotMessageId);
    expect(before).toHaveLength(3);

    await mail.close();
    mail = await startFakeMail({ dir });

    expect(await listMail(mail.url)).toEqual(before);
    expect(await getMail(mail.url, plotMessageId)).toEqual(plotBefore);
  });

  it('deletes everything over the API and through the page button', async () => {
    const res = await fetch(`${mail.url}/api/messages`, { method: 'DELETE' });
    expect(res.status).toBe(204);
    expect(await listMail(mail.url)).toEqual([]);
    expect(await jsonFiles(dir)).toEqual([]);

    await send(mail.smtpPort, { from: 'no-reply@tillwell.test', to: 'eve@example.org', subject: 'One more', text: 'hi' });
    expect(await listMail(mail.url)).toHaveLength(1);
    const cleared = await fetch(`${mail.url}/clear`, { method: 'POST', redirect: 'manual' });
    expect(cleared.status).toBe(303);
    expect(cleared.headers.get('location')).toBe('/');
    expect(await listMail(mail.url)).toEqual([]);

    const page = await (await fetch(`${mail.url}/`)).text();
    expect(page).toContain('No messages yet. Anything Tillwell sends in development lands here.');

    await send(mail.smtpPort, { from: 'no-reply@tillwell.test', to: 'eve@example.org', subject: 'Again', text: 'hi' });
    await clearMail(mail.url);
    expect(await listMail(mail.url)).toEqual([]);
  });
});
