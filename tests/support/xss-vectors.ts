// Script-injection vectors for the hostile-content tests. Each one, if it ever runs, sets
// `window.__fluxyardXss` (or its parent's, from a frame) to its own number, so a test can tell
// which got through; each carries a visible token ("xv07") that must still be readable on the
// page, so an escape that silently swallows text is caught too. The set follows the OWASP XSS
// Filter Evasion Cheat Sheet and the OWASP XSS Prevention Cheat Sheet (tags, event-handler
// attributes, javascript:/vbscript:/data: URLs, entity and encoding tricks, broken markup,
// breaking out of attributes, <title>, <textarea> and <script> contexts), PortSwigger's XSS cheat
// sheet (events that fire without a click: onerror, onload, ontoggle, onfocus+autofocus,
// onbegin, onstart), published mutation-XSS (mXSS) patterns around <noscript>, <svg>/<math>
// namespace confusion and <style>, and the CommonMark 0.31 constructs that make links without
// writing HTML (inline, reference, angle-bracket and autolinks; entities in destinations, §6.3–6.5).

export const XSS_FLAG = "__fluxyardXss";

export type XssVector = {
  /** "xv07": also the visible token in the vector. */
  id: string;
  kind: "tag" | "attribute" | "url" | "svg" | "entity" | "broken" | "mxss" | "context" | "markdown" | "style" | "frame" | "form" | "unicode";
  text: string;
};

const set = (n: number) => `window.${XSS_FLAG}=${n}`;
const parentSet = (n: number) => `parent.${XSS_FLAG}=${n}`;
const b64 = (text: string) => Buffer.from(text, "utf8").toString("base64");
const entities = (text: string) => [...text].map((c) => `&#${c.charCodeAt(0)};`).join("");

const raw: [XssVector["kind"], (n: number, token: string) => string][] = [
  ["tag", (n, t) => `<script>${set(n)}</script> ${t}`],
  ["tag", (n, t) => `<SCRIPT SRC=data:text/javascript,${set(n)}></SCRIPT> ${t}`],
  ["attribute", (n, t) => `<img src=x onerror="${set(n)}"> ${t}`],
  ["attribute", (n, t) => `<img src="/no-such-image.png" onerror=${set(n)} alt=${t}>`],
  ["svg", (n, t) => `<svg onload=${set(n)}> ${t}`],
  ["svg", (n, t) => `<svg><script>${set(n)}</script></svg> ${t}`],
  ["attribute", (n, t) => `<body onload=${set(n)}> ${t}`],
  ["frame", (n, t) => `<iframe src="javascript:${parentSet(n)}"></iframe> ${t}`],
  ["frame", (n, t) => `<iframe srcdoc="<script>${parentSet(n)}</script>"></iframe> ${t}`],
  ["frame", (n, t) => `<object data="javascript:${set(n)}"></object> ${t}`],
  ["frame", (n, t) => `<embed src="data:text/html,<script>${parentSet(n)}</script>"> ${t}`],
  ["url", (n, t) => `<a href="javascript:${set(n)}">${t} link</a>`],
  ["attribute", (n, t) => `<details open ontoggle=${set(n)}>${t}</details>`],
  ["attribute", (n, t) => `<input autofocus onfocus=${set(n)} value=${t}>`],
  ["attribute", (n, t) => `<video><source onerror="${set(n)}"></video> ${t}`],
  ["attribute", (n, t) => `<audio src=x onerror=${set(n)}> ${t}`],
  ["attribute", (n, t) => `<marquee onstart=${set(n)}>${t}</marquee>`],
  ["style", (n, t) => `<div style="background:url(javascript:${set(n)})">${t}</div>`],
  ["style", (n, t) => `<div style="width:expression(${set(n)})">${t}</div>`],
  ["style", (n, t) => `<style>@import "javascript:${set(n)}";body{background:url("javascript:${set(n)}")}</style> ${t}`],
  ["form", (n, t) => `<form action="javascript:${set(n)}"><button>${t}</button></form>`],
  ["form", (n, t) => `<form><button formaction="javascript:${set(n)}">${t}</button></form>`],
  ["context", (n, t) => `<meta http-equiv="refresh" content="0;url=javascript:${set(n)}"> ${t}`],
  ["context", (n, t) => `<base href="javascript:${set(n)}//"> ${t}`],
  ["context", (n, t) => `<link rel=stylesheet href="javascript:${set(n)}"> ${t}`],
  ["mxss", (n, t) => `<template><img src=x onerror=${set(n)}></template> ${t}`],
  ["mxss", (n, t) => `<noscript><p title="</noscript><img src=x onerror=${set(n)}>">${t}`],
  ["mxss", (n, t) => `<svg></p><style><a id="</style><img src=1 onerror=${set(n)}>">${t}`],
  ["mxss", (n, t) => `<math><mtext><table><mglyph><style><img src=x onerror=${set(n)}>${t}`],
  ["context", (n, t) => `</textarea><script>${set(n)}</script> ${t}`],
  ["context", (n, t) => `"><script>${set(n)}</script> ${t}`],
  ["context", (n, t) => `'><img src=x onerror=${set(n)}> ${t}`],
  ["context", (n, t) => `</title><script>${set(n)}</script> ${t}`],
  ["context", (n, t) => `</script><script>${set(n)}</script> ${t}`],
  ["broken", (n, t) => `<!--><img src=x onerror=${set(n)}>--> ${t}`],
  ["broken", (n, t) => `<!-- --!><img src=x onerror=${set(n)}> --> ${t}`],
  ["broken", (n, t) => `<img src=x onerror=${set(n)} ${t}`],
  ["broken", (n, t) => `<scr<script>ipt>${set(n)}</scr</script>ipt> ${t}`],
  ["broken", (n, t) => `<<script>script>${set(n)}<</script>/script> ${t}`],
  ["broken", (n, t) => `<img """><script>${set(n)}</script>"> ${t}`],
  ["url", (n, t) => `<IMG SRC=JaVaScRiPt:${set(n)}> ${t}`],
  ["attribute", (n, t) => `<img src=x:y onerror=eval(src.replace('x:y','${set(n)}'))> ${t}`],
  ["entity", (n, t) => `<a href="${entities("javascript:")}${set(n)}">${t}</a>`],
  ["entity", (n, t) => `<a href="jav&#x09;ascript:${set(n)}">${t}</a>`],
  ["svg", (n, t) => `<svg><a xlink:href="javascript:${set(n)}"><text x=20 y=20>${t}</text></a></svg>`],
  ["svg", (n, t) => `<svg><animate onbegin=${set(n)} attributeName=x dur=1s> ${t}`],
  ["svg", (n, t) => `<svg><foreignObject><img src=x onerror=${set(n)}></foreignObject></svg> ${t}`],
  ["url", (n, t) => `<math href="javascript:${set(n)}">${t}</math>`],
  ["attribute", (n, t) => `<xss id=x tabindex=1 autofocus onfocusin=${set(n)}>${t}</xss>`],
  ["frame", (n, t) => `<object data="data:text/html;base64,${b64(`<script>${parentSet(n)}</script>`)}"></object> ${t}`],
  ["markdown", (n, t) => `[${t} link](javascript:${set(n)})`],
  ["markdown", (n, t) => `[${t} link](JaVaScRiPt:${set(n)})`],
  ["markdown", (_n, t) => `[${t} link](vbscript:msgbox(1))`],
  ["markdown", (n, t) => `[${t} link](data:text/html;base64,${b64(`<script>${parentSet(n)}</script>`)})`],
  ["markdown", (n, t) => `![${t}](javascript:${set(n)})`],
  ["markdown", (n, t) => `![${t}](data:image/svg+xml;base64,${b64(`<svg xmlns="http://www.w3.org/2000/svg" onload="${set(n)}"/>`)})`],
  ["markdown", (n, t) => `[${t} ref][r${n}]\n\n[r${n}]: javascript:${set(n)}`],
  ["markdown", (n, t) => `<javascript:${set(n)};${t}>`],
  ["markdown", (n, t) => `[${t}](java&#x73;cript:${set(n)})`],
  ["markdown", (n, t) => `[${t}](<javascript:${set(n)}>)`],
  ["markdown", (n, t) => `[${t}](  javascript:${set(n)} "a title")`],
  ["markdown", (n, t) => `**<img src=x onerror=${set(n)}>** ${t}`],
  ["markdown", (n, t) => `\`<script>${set(n)}</script>\` ${t}`],
  ["markdown", (n, t) => `[${t}](https://notes.invalid/" onmouseover="${set(n)})`],
  ["markdown", (n, t) => `![${t}" onerror="${set(n)}](x.png)`],
  ["markdown", (n, t) => `[${t}]: javascript:${set(n)}\n\n[${t}]`],
  ["unicode", (n, t) => `<ſcript>${set(n)}</ſcript> ${t}`],
  ["unicode", (n, t) => `＜script＞${set(n)}＜/script＞ ${t}`],
  ["entity", (n, t) => `%3Cscript%3E${set(n)}%3C/script%3E ${t}`],
  ["entity", (n, t) => `\\u003cscript\\u003e${set(n)}\\u003c/script\\u003e ${t}`],
  ["unicode", (n, t) => `<scr\u200bipt>${set(n)}</scr\u200bipt> ${t}`],
  ["url", (n, t) => `<a href="  javascript:${set(n)}">${t}</a>`],
  ["entity", (n, t) => `<img src=x onerror="&#119;indow.${XSS_FLAG}=${n}"> ${t}`],
  ["entity", (n, t) => `&lt;script&gt;${set(n)}&lt;/script&gt; ${t}`],
  ["frame", (n, t) => `<portal src="javascript:${parentSet(n)}"></portal><frameset onload=${set(n)}> ${t}`],
];

export const XSS_VECTORS: readonly XssVector[] = raw.map(([kind, make], i) => {
  const n = i + 1;
  const id = `xv${String(n).padStart(2, "0")}`;
  return { id, kind, text: make(n, id) };
});

/** All vectors as one Markdown document, a blank line between them, with a readable first and last line. */
export function allVectorsMarkdown(label: string): string {
  return [`Start of ${label}.`, ...XSS_VECTORS.map((v) => v.text), `End of ${label}.`].join("\n\n");
}

/** One vector for a short plain-text field, chosen in turn so every vector lands in plain fields too. */
export function vectorFor(index: number): XssVector {
  return XSS_VECTORS[index % XSS_VECTORS.length]!;
}
