// The outbox as a person sees it while running Fluxyard locally: a plain list and a reading
// view. No scripts at all; the message HTML runs in a sandboxed srcdoc frame.
import { escapeHtml } from "./escape-html";
import type { StoredMessage } from "./message-store";

// srcdoc frames inherit this policy: remote images and inline styles of a message still show,
// scripts never run.
export const OUTBOX_CSP =
  "default-src 'none'; img-src * data: blob:; style-src 'unsafe-inline' *; font-src * data:; frame-src 'self'; form-action 'self'";

const FRAME_SANDBOX = "allow-popups allow-popups-to-escape-sandbox allow-top-navigation-by-user-activation";

const STYLE = `
  :root { --paper: #f7f5f0; --sheet: #fffdf9; --graphite: #2a2c30; --pencil: #6b6e74; --rule: #dcd7cc; --copper: #a8582a; }
  * { box-sizing: border-box; }
  body { margin: 0; background: var(--paper); color: var(--graphite);
         font: 15px/1.5 system-ui, -apple-system, "Segoe UI", sans-serif; }
  header { border-bottom: 3px solid var(--copper); background: var(--sheet); padding: 14px 24px; }
  header p { margin: 2px 0 0; color: var(--pencil); font-size: 13px; }
  h1 { margin: 0; font-size: 18px; letter-spacing: 0.01em; }
  h1 span { color: var(--copper); }
  main { max-width: 1040px; margin: 0 auto; padding: 20px 24px 48px; }
  a { color: var(--copper); }
  table { width: 100%; border-collapse: collapse; background: var(--sheet); border: 1px solid var(--rule); }
  th, td { text-align: left; padding: 8px 12px; border-bottom: 1px solid var(--rule); vertical-align: top; }
  th { font-size: 12px; text-transform: uppercase; letter-spacing: 0.06em; color: var(--pencil); font-weight: 600; }
  td.when, .mono { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; font-size: 13px; white-space: nowrap; }
  .bar { display: flex; justify-content: space-between; align-items: center; margin-bottom: 12px; gap: 12px; }
  button { font: inherit; background: var(--graphite); color: var(--sheet); border: 0; padding: 6px 12px; cursor: pointer; }
  button:hover { background: var(--copper); }
  .empty { background: var(--sheet); border: 1px dashed var(--rule); padding: 28px; text-align: center; color: var(--pencil); }
  dl { display: grid; grid-template-columns: max-content 1fr; gap: 4px 16px; margin: 0 0 16px; background: var(--sheet);
       border: 1px solid var(--rule); padding: 12px 16px; }
  dt { color: var(--pencil); }
  dd { margin: 0; word-break: break-word; }
  h2 { font-size: 15px; margin: 24px 0 8px; }
  iframe { width: 100%; height: 65vh; min-height: 320px; border: 1px solid var(--rule); background: #fff; resize: vertical; }
  pre { white-space: pre-wrap; word-break: break-word; background: var(--sheet); border: 1px solid var(--rule); padding: 12px 16px; margin: 0; }
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
<header>
  <h1>Fluxyard <span>·</span> local development outbox</h1>
  <p>Mail the app sent while running on this machine. Nothing shown here was delivered to anyone.</p>
</header>
<main>
${body}
</main>
</body>
</html>`;
}

function formatTime(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())} ${pad(date.getHours())}:${pad(date.getMinutes())}:${pad(date.getSeconds())}`;
}

function timeElement(iso: string): string {
  return `<time datetime="${escapeHtml(iso)}">${escapeHtml(formatTime(iso))}</time>`;
}

export function renderOutbox(messages: StoredMessage[]): string {
  const count = `${messages.length} ${messages.length === 1 ? "message" : "messages"}, newest first`;
  const bar = `<div class="bar"><span>${count} · <a href="/">reload</a></span>
  <form method="post" action="/clear"><button type="submit">Empty the outbox</button></form></div>`;
  if (messages.length === 0) {
    return layout(
      "Outbox · Fluxyard (local)",
      `${bar}<p class="empty">No mail yet. Sign in, place an order or trigger any other e-mail in the app and it appears here.</p>`,
    );
  }
  const rows = messages
    .map(
      (m) => `<tr>
  <td class="when">${timeElement(m.createdAt)}</td>
  <td>${escapeHtml(m.to.join(", "))}</td>
  <td><a href="/messages/${encodeURIComponent(m.id)}">${escapeHtml(m.subject)}</a></td>
</tr>`,
    )
    .join("\n");
  return layout(
    "Outbox · Fluxyard (local)",
    `${bar}
<table>
<thead><tr><th scope="col">Sent</th><th scope="col">Recipient</th><th scope="col">Subject</th></tr></thead>
<tbody>
${rows}
</tbody>
</table>`,
  );
}

function addressRow(label: string, addresses: string[]): string {
  return addresses.length ? `<dt>${label}</dt><dd>${escapeHtml(addresses.join(", "))}</dd>` : "";
}

export function renderMessage(message: StoredMessage): string {
  // Links in a message open in a new, unsandboxed tab so a magic link works as it would in a mail client.
  const framed = message.html === null ? null : `<base target="_blank">${message.html}`;
  const tags = message.tags.map((t) => `${t.name}=${t.value}`).join(", ");
  return layout(
    `${message.subject} · Outbox · Fluxyard (local)`,
    `<p><a href="/">← back to the outbox</a></p>
<dl>
  <dt>Subject</dt><dd>${escapeHtml(message.subject)}</dd>
  <dt>From</dt><dd>${escapeHtml(message.from)}</dd>
  ${addressRow("To", message.to)}
  ${addressRow("Cc", message.cc)}
  ${addressRow("Bcc", message.bcc)}
  ${addressRow("Reply to", message.replyTo)}
  <dt>Sent</dt><dd class="mono">${timeElement(message.createdAt)}</dd>
  <dt>Id</dt><dd class="mono">${escapeHtml(message.id)}</dd>
  ${tags ? `<dt>Tags</dt><dd class="mono">${escapeHtml(tags)}</dd>` : ""}
</dl>
<h2>HTML version</h2>
${
  framed === null
    ? `<p class="empty">This message has no HTML part.</p>`
    : `<iframe title="HTML version of the message" sandbox="${FRAME_SANDBOX}" srcdoc="${escapeHtml(framed)}"></iframe>`
}
<h2>Text version</h2>
${message.text === null ? `<p class="empty">This message has no text part.</p>` : `<pre>${escapeHtml(message.text)}</pre>`}`,
  );
}

export function renderNotFound(): string {
  return layout("Not found · Outbox · Fluxyard (local)", `<p class="empty">No message with that id. <a href="/">Back to the outbox</a></p>`);
}
