/**
 * The inbox a developer opens in a browser to see what Lagwise sent. Plain server-rendered HTML
 * with no scripts and no assets from elsewhere, so it works offline and cannot be broken by the
 * mail it shows: message HTML only ever runs inside a sandboxed iframe.
 */
import type { StoredMessage } from './store.ts';

export function escapeHtml(value: string): string {
  return value
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

function formatTime(iso: string): string {
  return `${iso.slice(0, 10)} ${iso.slice(11, 19)} UTC`;
}

function formatSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

const style = `
  body { font: 15px/1.45 system-ui, sans-serif; margin: 0; color: #1d2327; background: #f6f7f7; }
  header { background: #1d3b34; color: #fff; padding: 12px 24px; display: flex; gap: 16px; align-items: baseline; }
  header a { color: #fff; }
  main { padding: 16px 24px; max-width: 1100px; }
  table { border-collapse: collapse; width: 100%; background: #fff; }
  th, td { text-align: left; padding: 6px 10px; border-bottom: 1px solid #dcdcde; vertical-align: top; }
  th { background: #f0f0f1; font-weight: 600; }
  td.when { white-space: nowrap; color: #50575e; }
  .down { background: #b32d2e; color: #fff; padding: 8px 24px; }
  .empty, .note { color: #50575e; }
  iframe { width: 100%; height: 520px; border: 1px solid #dcdcde; background: #fff; }
  pre { white-space: pre-wrap; background: #fff; border: 1px solid #dcdcde; padding: 12px; }
  dl { display: grid; grid-template-columns: max-content 1fr; gap: 4px 16px; background: #fff; padding: 12px; border: 1px solid #dcdcde; }
  dt { font-weight: 600; } dd { margin: 0; word-break: break-word; }
  h2 { font-size: 17px; margin: 24px 0 8px; }
`;

function page(title: string, body: string, down: boolean): string {
  const banner = down
    ? '<div class="down" role="status">Outage switch is ON: the Resend API answers 503 until <code>POST /_fake/outage {"down": false}</code>.</div>'
    : '';
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)} · Lagwise mail fake</title>
<style>${style}</style>
</head>
<body>
<header><strong>Lagwise mail fake</strong><a href="/">Inbox</a><a href="/_fake/messages">JSON</a></header>
${banner}
<main>
${body}
</main>
</body>
</html>`;
}

export function renderInbox(messages: StoredMessage[], down: boolean): string {
  if (messages.length === 0) {
    return page('Inbox', '<h1>Inbox</h1><p class="empty">No messages yet.</p>', down);
  }
  const rows = messages
    .map(
      (m) => `<tr>
<td class="when"><time datetime="${escapeHtml(m.created_at)}">${escapeHtml(formatTime(m.created_at))}</time></td>
<td>${escapeHtml(m.to.join(', '))}</td>
<td><a href="/messages/${encodeURIComponent(m.id)}">${escapeHtml(m.subject || '(no subject)')}</a>${m.attachments.length > 0 ? ` <span class="note">(${m.attachments.length} attachment${m.attachments.length === 1 ? '' : 's'})</span>` : ''}</td>
<td>${escapeHtml(m.from)}</td>
</tr>`,
    )
    .join('\n');
  return page(
    'Inbox',
    `<h1>Inbox</h1>
<p>${messages.length} message${messages.length === 1 ? '' : 's'}, newest first.</p>
<table>
<thead><tr><th scope="col">Time</th><th scope="col">To</th><th scope="col">Subject</th><th scope="col">From</th></tr></thead>
<tbody>
${rows}
</tbody>
</table>`,
    down,
  );
}

export function attachmentUrl(messageId: string, index: number): string {
  return `/messages/${encodeURIComponent(messageId)}/attachments/${index}`;
}

/** Inline images are referenced as `cid:…`; point them at the fake's own download URL. */
function resolveContentIds(message: StoredMessage): string {
  let html = message.html ?? '';
  message.attachments.forEach((attachment, index) => {
    if (attachment.content_id) html = html.replaceAll(`cid:${attachment.content_id}`, attachmentUrl(message.id, index));
  });
  return html;
}

export function renderMessage(message: StoredMessage, down: boolean): string {
  const field = (label: string, value: string | null | undefined): string =>
    value ? `<dt>${escapeHtml(label)}</dt><dd>${escapeHtml(value)}</dd>` : '';
  const list = (values: string[] | null): string | null => (values && values.length > 0 ? values.join(', ') : null);

  const customHeaders = Object.entries(message.headers ?? {})
    .map(([name, value]) => field(name, value))
    .join('');
  const tags =
    message.tags && message.tags.length > 0
      ? `<h2>Tags</h2><table><thead><tr><th scope="col">Name</th><th scope="col">Value</th></tr></thead><tbody>${message.tags
          .map((t) => `<tr><td>${escapeHtml(t.name)}</td><td>${escapeHtml(t.value)}</td></tr>`)
          .join('')}</tbody></table>`
      : '';
  const attachments =
    message.attachments.length > 0
      ? `<h2>Attachments</h2><ul>${message.attachments
          .map(
            (a, index) =>
              `<li><a href="${attachmentUrl(message.id, index)}" download="${escapeHtml(a.filename)}">${escapeHtml(a.filename)}</a> (${escapeHtml(a.content_type)}, ${formatSize(a.size)})</li>`,
          )
          .join('')}</ul>`
      : '';
  const htmlBody =
    message.html !== null
      ? `<h2>HTML body</h2><iframe sandbox title="HTML body of the message" srcdoc="${escapeHtml(resolveContentIds(message))}"></iframe>`
      : '';
  const textBody = message.text !== null ? `<h2>Text body</h2><pre>${escapeHtml(message.text)}</pre>` : '';

  return page(
    message.subject || '(no subject)',
    `<p><a href="/">← Inbox</a></p>
<h1>${escapeHtml(message.subject || '(no subject)')}</h1>
<dl>
${field('From', message.from)}
${field('To', list(message.to))}
${field('Cc', list(message.cc))}
${field('Bcc', list(message.bcc))}
${field('Reply-To', list(message.reply_to))}
${field('Date', formatTime(message.created_at))}
${field('Id', message.id)}
${customHeaders}
</dl>
${attachments}
${tags}
${htmlBody}
${textBody}`,
    down,
  );
}

export function renderNotFound(down: boolean): string {
  return page('Not found', '<h1>Not found</h1><p>No such message. <a href="/">Back to the inbox</a>.</p>', down);
}
