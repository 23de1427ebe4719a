// The hosted pages' shell. A look of its own (sage paper, ink-blue actions, a hazard-striped
// test band) so nobody mistakes these pages for the shop or for a real payment page.

export function esc(value: string | number | null | undefined): string {
  return String(value ?? "")
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

const STYLE = `
:root { color-scheme: light; --paper: #eef2ec; --card: #ffffff; --ink: #1d2430; --muted: #5b6472;
  --line: #c9d1c6; --action: #24477a; --action-ink: #ffffff; --warn: #8a5a00; --warn-bg: #fff4d6;
  --stop: #9b1c1c; --stop-bg: #fde8e8; --ok: #1f6b52; }
* { box-sizing: border-box; }
body { margin: 0; background: var(--paper); color: var(--ink);
  font: 16px/1.5 system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif; }
.band { background: repeating-linear-gradient(135deg, #f0c24b 0 14px, #1d2430 14px 28px); height: 10px; }
.banner { background: var(--warn-bg); border-bottom: 1px solid #e5c97a; color: var(--warn);
  padding: 10px 20px; font-weight: 600; text-align: center; }
main { max-width: 720px; margin: 32px auto; padding: 0 16px; }
.card { background: var(--card); border: 1px solid var(--line); border-radius: 6px; padding: 24px 28px; }
.stand-in { font-size: 13px; letter-spacing: .08em; text-transform: uppercase; color: var(--muted); margin: 0 0 4px; }
h1 { font-size: 26px; margin: 0 0 16px; }
h2 { font-size: 18px; margin: 24px 0 8px; }
table { width: 100%; border-collapse: collapse; margin: 8px 0 16px; }
th, td { text-align: left; padding: 6px 4px; border-bottom: 1px solid var(--line); }
td.num, th.num { text-align: right; }
.mono, td.num { font-family: ui-monospace, "SFMono-Regular", Menlo, Consolas, monospace; }
tfoot td { font-weight: 700; border-bottom: 0; }
label { display: block; font-weight: 600; margin: 14px 0 4px; }
input[type=text], input[type=email] { width: 100%; padding: 9px 10px; border: 1px solid #8f99a8; border-radius: 4px;
  font: inherit; }
input.mono { font-family: ui-monospace, Menlo, Consolas, monospace; letter-spacing: .04em; }
.row { display: flex; gap: 12px; } .row > div { flex: 1; }
.hint { color: var(--muted); font-size: 14px; margin: 4px 0 0; }
button { margin-top: 20px; background: var(--action); color: var(--action-ink); border: 0; border-radius: 4px;
  padding: 11px 20px; font: inherit; font-weight: 700; cursor: pointer; }
button:focus-visible, a:focus-visible, input:focus-visible { outline: 3px solid #f0c24b; outline-offset: 2px; }
a { color: var(--action); }
.actions { display: flex; align-items: center; gap: 20px; flex-wrap: wrap; }
.actions a { margin-top: 20px; }
.alert { border: 1px solid; border-radius: 4px; padding: 10px 12px; margin: 0 0 16px; }
.alert.stop { color: var(--stop); background: var(--stop-bg); border-color: #f0b4b4; }
.alert.note { color: var(--warn); background: var(--warn-bg); border-color: #e5c97a; }
.cards { list-style: none; padding: 0; margin: 0; }
.cards li { padding: 4px 0; }
footer { color: var(--muted); font-size: 13px; margin-top: 20px; text-align: center; }
`;

export function renderPage(input: { title: string; banner: string; body: string }): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${esc(input.title)}</title>
<style>${STYLE}</style>
</head>
<body>
<div class="band" aria-hidden="true"></div>
<p class="banner">${esc(input.banner)}</p>
<main>
<div class="card">
<p class="stand-in">Fluxyard payments stand-in · local test page</p>
${input.body}
</div>
<footer>Served by the local payments fake on this computer. No card is charged and no money moves.</footer>
</main>
</body>
</html>`;
}

export function renderMessagePage(title: string, message: string, link?: { href: string; label: string }): string {
  const action = link ? `<p><a href="${esc(link.href)}">${esc(link.label)}</a></p>` : "";
  return renderPage({
    title,
    banner: "Local test page — no real money",
    body: `<h1>${esc(title)}</h1><p>${esc(message)}</p>${action}`,
  });
}
