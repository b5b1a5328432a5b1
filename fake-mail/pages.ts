import { splitUrls } from './links';
import type { Message } from './schema';

/** Escapes text for use in HTML element content and in double- or single-quoted attributes. */
export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/** Escapes plain text and turns its http(s) URLs into links that open in a new tab. */
export function autolink(text: string): string {
  return splitUrls(text)
    .map((part) =>
      part.kind === 'url'
        ? `<a href="${escapeHtml(part.value)}" target="_blank" rel="noopener noreferrer">${escapeHtml(part.value)}</a>`
        : escapeHtml(part.value),
    )
    .join('');
}

const STYLE = `
  :root { color-scheme: light; }
  * { box-sizing: border-box; }
  body { margin: 0; background: #faf7f0; color: #3d2e26; font-family: "Work Sans", system-ui, sans-serif; line-height: 1.55; }
  main { max-width: 64rem; margin: 0 auto; padding: 2rem 1.25rem 4rem; }
  a { color: #2e6b8c; }
  a:focus-visible, button:focus-visible { outline: 2px solid #2e6b8c; outline-offset: 2px; }
  h1 { font-size: 1.5rem; font-weight: 600; margin: 0 0 1.25rem; overflow-wrap: anywhere; }
  h2 { font-size: 1.05rem; font-weight: 600; margin: 2rem 0 .5rem; }
  .bar { display: flex; align-items: baseline; justify-content: space-between; gap: 1rem; flex-wrap: wrap; margin-bottom: 1rem; }
  .bar h1 { margin: 0; }
  .muted { color: #6f5f55; }
  table { width: 100%; border-collapse: collapse; background: #fff; border: 1px solid #e6dfd1; border-radius: .5rem; }
  th, td { text-align: left; padding: .6rem .8rem; border-bottom: 1px solid #eee7da; vertical-align: top; }
  th { font-size: .85rem; font-weight: 600; color: #6f5f55; }
  tr:last-child td { border-bottom: 0; }
  td.when { white-space: nowrap; font-variant-numeric: tabular-nums; }
  td { overflow-wrap: anywhere; }
  button { font: inherit; color: #3d2e26; background: #fff; border: 1px solid #cbbfae; border-radius: .375rem; padding: .3rem .8rem; cursor: pointer; }
  button:hover { background: #f3eee4; }
  .empty { background: #fff; border: 1px dashed #cbbfae; border-radius: .5rem; padding: 2rem; text-align: center; }
  dl { display: grid; grid-template-columns: max-content 1fr; gap: .3rem 1rem; margin: 0; background: #fff; border: 1px solid #e6dfd1; border-radius: .5rem; padding: 1rem; }
  dt { font-weight: 600; color: #6f5f55; }
  dd { margin: 0; overflow-wrap: anywhere; }
  pre { white-space: pre-wrap; overflow-wrap: anywhere; margin: 0; background: #fff; border: 1px solid #e6dfd1; border-radius: .5rem; padding: 1rem; font-family: ui-monospace, "Cascadia Mono", Menlo, Consolas, monospace; font-size: .9rem; }
  iframe { display: block; width: 100%; min-height: 32rem; background: #fff; border: 1px solid #e6dfd1; border-radius: .5rem; }
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
${body}
</main>
</body>
</html>`;
}

function formatWhen(iso: string): string {
  return `${iso.slice(0, 10)} ${iso.slice(11, 19)} UTC`;
}

/** The inbox list page, newest first, with the empty state when nothing has arrived. */
export function renderInboxPage(messages: Message[]): string {
  const header = `<div class="bar">
<h1>Tillwell test inbox</h1>
<form method="post" action="/clear"><button type="submit">Delete all</button></form>
</div>`;
  if (messages.length === 0) {
    return layout(
      'Tillwell test inbox',
      `${header}
<p class="empty">No messages yet. Anything Tillwell sends in development lands here.</p>`,
    );
  }
  const rows = messages
    .map(
      (m) => `<tr>
<td class="when"><time datetime="${escapeHtml(m.receivedAt)}">${escapeHtml(formatWhen(m.receivedAt))}</time></td>
<td>${escapeHtml(m.to.join(', ') || m.envelope.to.join(', '))}</td>
<td><a href="/messages/${escapeHtml(m.id)}">${m.subject ? escapeHtml(m.subject) : '<span class="muted">(no subject)</span>'}</a></td>
</tr>`,
    )
    .join('\n');
  return layout(
    'Tillwell test inbox',
    `${header}
<p class="muted">${messages.length} message${messages.length === 1 ? '' : 's'}, newest first.</p>
<table>
<thead><tr><th scope="col">Received</th><th scope="col">To</th><th scope="col">Subject</th></tr></thead>
<tbody>
${rows}
</tbody>
</table>`,
  );
}

// A base target makes links open in a new tab instead of loading inside the small frame.
function withBaseTarget(html: string): string {
  const base = '<base target="_blank">';
  const head = /<head\b[^>]*>/i.exec(html);
  if (!head) return base + html;
  const end = head.index + head[0].length;
  return html.slice(0, end) + base + html.slice(end);
}

/** One message: headers, the escaped and autolinked text part, and the HTML part in a script-free sandbox. */
export function renderMessagePage(m: Message): string {
  const from = m.fromName ? `${m.fromName} <${m.from}>` : m.from;
  const fields: Array<[string, string]> = [
    ['From', from],
    ['To', m.to.join(', ')],
    ...(m.cc.length > 0 ? ([['Cc', m.cc.join(', ')]] as Array<[string, string]>) : []),
    ['Envelope to', m.envelope.to.join(', ')],
    ['Subject', m.subject],
    ['Date', m.date],
    ['Received', m.receivedAt],
    ['Message-ID', m.messageId ?? ''],
    ...Object.entries(m.headers),
  ];
  const headerList = fields
    .map(([name, value]) => `<dt>${escapeHtml(name)}</dt><dd>${escapeHtml(value)}</dd>`)
    .join('\n');
  const text = m.text
    ? `<pre>${autolink(m.text)}</pre>`
    : '<p class="muted">This message has no plain-text part.</p>';
  const html =
    m.html === null
      ? '<p class="muted">This message has no HTML part.</p>'
      : `<iframe title="HTML body" sandbox="allow-popups allow-popups-to-escape-sandbox" referrerpolicy="no-referrer" srcdoc="${escapeHtml(
          withBaseTarget(m.html),
        )}"></iframe>`;
  return layout(
    `${m.subject || '(no subject)'} · Tillwell test inbox`,
    `<p><a href="/">&larr; All messages</a> · <a href="/api/messages/${escapeHtml(m.id)}">JSON</a></p>
<h1>${m.subject ? escapeHtml(m.subject) : '(no subject)'}</h1>
<dl>
${headerList}
</dl>
<h2>Plain text</h2>
${text}
<h2>HTML</h2>
${html}`,
  );
}

/** A plain page for an id that is not in the inbox. */
export function renderNotFoundPage(): string {
  return layout(
    'Not found · Tillwell test inbox',
    `<p><a href="/">&larr; All messages</a></p>
<h1>No such message</h1>
<p>It may have been deleted.</p>`,
  );
}
