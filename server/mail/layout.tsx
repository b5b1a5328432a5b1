import type { ReactElement, ReactNode } from 'react';
import { Body, Button, Container, Head, Hr, Html, Link, Preview, Section, Text, render } from '@react-email/components';
import type { OutgoingMail } from './mailer';
import { mailTheme as t } from './theme';

/** The two links of optional mail: a page that asks before turning that kind off, and the one-click address (RFC 8058). */
export interface StopLink {
  /** What stops, in a few words: "club news from Elm Row Growers". */
  what: string;
  /** The confirm page (GET) for people. */
  pageUrl: string;
  /** The address the List-Unsubscribe header carries; a POST there turns the mail off. */
  oneClickUrl: string;
}

export interface MailAction {
  label: string;
  url: string;
}

export interface LayoutProps {
  /** The line clients show beside the subject. */
  preview: string;
  greeting: string;
  children: ReactNode;
  actions?: MailAction[];
  /** Why the person got it. */
  why: ReactNode;
  /** Where to change e-mail choices (shown in the footer when given). */
  choices?: MailAction;
  /** Optional mail only: the stop link in the footer (and the List-Unsubscribe headers). */
  stop?: StopLink;
}

const text = { fontSize: '16px', lineHeight: '1.5', margin: '0 0 16px', color: t.soil } as const;
const small = { fontSize: '13px', lineHeight: '1.5', margin: '0 0 8px', color: t.stone } as const;
const link = { color: t.water, textDecoration: 'underline', wordBreak: 'break-all' } as const;

/** A paragraph of the body. */
export function P({ children }: { children: ReactNode }) {
  return <Text style={text}>{children}</Text>;
}

/** A link in running text or the footer. */
export function A({ href, children }: { href: string; children?: ReactNode }) {
  return (
    <Link href={href} style={link}>
      {children ?? href}
    </Link>
  );
}

/**
 * The one layout of every e-mail: the Tillwell header, the body, the actions as buttons (each with its
 * address written out for clients that hide buttons), why the person got it, and for optional mail the
 * link that stops it. Readable at 320 px: one column, 16 px text, buttons as wide as they need.
 */
export function MailLayout(p: LayoutProps) {
  return (
    <Html lang="en">
      <Head>
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <meta name="color-scheme" content="light" />
      </Head>
      <Preview>{p.preview}</Preview>
      <Body style={{ margin: 0, padding: 0, backgroundColor: t.paper, fontFamily: t.font, color: t.soil }}>
        <Container style={{ maxWidth: '560px', width: '100%', margin: '0 auto', padding: '16px 12px' }}>
          <Section style={{ backgroundColor: t.leafTint, borderRadius: '8px 8px 0 0', padding: '14px 20px', borderBottom: `3px solid ${t.leaf}` }}>
            <Text style={{ margin: 0, fontSize: '22px', lineHeight: '1.2', fontWeight: 700, letterSpacing: '0.02em', color: t.leaf, fontFamily: t.font }}>Tillwell</Text>
          </Section>
          <Section style={{ backgroundColor: t.white, border: `1px solid ${t.paperLine}`, borderTop: 'none', borderRadius: '0 0 8px 8px', padding: '20px' }}>
            <Text style={text}>{p.greeting}</Text>
            {p.children}
            {(p.actions ?? []).map((a) => (
              <Section key={a.url} style={{ margin: '20px 0 8px' }}>
                <Button
                  href={a.url}
                  data-action-label={a.label}
                  style={{ backgroundColor: t.leaf, color: t.white, padding: '12px 20px', borderRadius: '8px', fontSize: '16px', fontWeight: 600, textDecoration: 'none' }}
                >
                  {a.label}
                </Button>
                {/* The address once more for clients that hide buttons; the text part already has it beside the label. */}
                <Text style={{ ...small, marginTop: '8px' }} data-skip-in-text="true">
                  Or open this address: <A href={a.url} />
                </Text>
              </Section>
            ))}
            <Hr style={{ borderColor: t.paperLine, margin: '24px 0 16px' }} />
            <Text style={small}>{p.why}</Text>
            {p.choices ? (
              <Text style={small}>
                {p.choices.label}: <A href={p.choices.url} />
              </Text>
            ) : null}
            {p.stop ? (
              <Text style={small}>
                Stop {p.stop.what} (no sign-in needed): <A href={p.stop.pageUrl} />
              </Text>
            ) : null}
          </Section>
        </Container>
      </Body>
    </Html>
  );
}

/** The List-Unsubscribe headers of optional mail (RFC 2369, RFC 8058 one-click). */
export function stopHeaders(stop: StopLink | undefined): Record<string, string> | undefined {
  if (!stop) return undefined;
  return { 'List-Unsubscribe': `<${stop.oneClickUrl}>`, 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' };
}

/** The text part writes each button as "Label: address" on its own line, as the mail read before. */
const htmlToTextOptions = {
  formatters: {
    action: (elem: { attribs?: Record<string, string> }, _walk: unknown, builder: { openBlock(o: object): void; addInline(s: string, o?: object): void; closeBlock(o: object): void }) => {
      builder.openBlock({ leadingLineBreaks: 1 });
      builder.addInline(`${elem.attribs?.['data-action-label'] ?? ''}: ${elem.attribs?.href ?? ''}`, { noWordTransform: true });
      builder.closeBlock({ trailingLineBreaks: 1 });
    },
  },
  selectors: [{ selector: 'a[data-action-label]', format: 'action' }],
};

/** Renders one template's element to the HTML and plain-text parts with React Email's render(). */
export async function renderMail(to: string, subject: string, element: ReactElement, stop?: StopLink): Promise<OutgoingMail> {
  const [html, text] = await Promise.all([render(element), render(element, { plainText: true, htmlToTextOptions })]);
  const headers = stopHeaders(stop);
  return { to, subject, html, text, ...(headers ? { headers } : {}) };
}
