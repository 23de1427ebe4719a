import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Markdown, safeHref, safeImageSrc } from "@/components/markdown";
import { tags, tagsNamed } from "./html";

const render = (source: string, imageOrigins?: string[]) =>
  renderToStaticMarkup(<Markdown imageOrigins={imageOrigins}>{source}</Markdown>);

// Attack strings follow the OWASP XSS Filter Evasion Cheat Sheet (script tags, event-handler
// attributes, javascript:/data: URLs, entity-obfuscated schemes, iframes and SVG onload).
describe("Markdown strips what could run script", () => {
  it("shows <script> as the text it is, never as an element", () => {
    const html = render("Before\n\n<script>alert('x')</script>\n\nAfter");
    expect(html).not.toMatch(/<script/i);
    expect(tagsNamed(html, "script")).toEqual([]);
    expect(html).toContain("&lt;script&gt;alert(&#x27;x&#x27;)&lt;/script&gt;");
    expect(html).toContain("Before");
    expect(html).toContain("After");
  });

  it("shows raw <img onerror>, <iframe> and <svg onload> as text, never as elements or attributes", () => {
    const html = render(
      'Text <img src="x" onerror="alert(1)"> more\n\n<iframe src="https://elsewhere.example/"></iframe>\n\n<svg onload="alert(2)"><circle r="4"/></svg>',
    );
    for (const name of ["img", "iframe", "svg"]) expect(tagsNamed(html, name), name).toEqual([]);
    expect(tags(html).flatMap((t) => Object.keys(t.attrs)).filter((a) => /^on/i.test(a))).toEqual([]);
    expect(html).not.toMatch(/<(img|iframe|svg)/i);
    // Shown as typed, so nothing the writer wrote disappears.
    expect(html).toContain("&lt;iframe src=&quot;https://elsewhere.example/&quot;&gt;&lt;/iframe&gt;");
    expect(html).toContain("Text &lt;img src=&quot;x&quot; onerror=&quot;alert(1)&quot;&gt; more");
  });

  it("removes javascript: links, including case and entity tricks, but keeps the link text", () => {
    for (const target of ["javascript:alert(1)", "JaVaScRiPt:alert(1)", "jav&#x09;ascript:alert(1)", "vbscript:msgbox(1)"]) {
      const html = render(`[press here](${target})`);
      expect(html, target).not.toMatch(/script:/i);
      expect(tagsNamed(html, "a").filter((a) => a.attrs.href !== undefined), target).toEqual([]);
      expect(html, target).toContain("press here");
    }
  });

  it("removes data: images", () => {
    const html = render("![dot](data:image/png;base64,iVBORw0KGgo=)");
    expect(html).not.toContain("data:");
    expect(tagsNamed(html, "img")).toEqual([]);
    expect(html).toContain("image not shown: dot");
  });
});

// Expected structure from the CommonMark 0.31 spec (emphasis §6.2, lists §5.3, links §6.3, ATX headings §4.2).
describe("Markdown keeps ordinary writing", () => {
  it("renders emphasis, strong emphasis, lists and inline code", () => {
    const html = render("Use *care* and **patience**.\n\n- one\n- two\n\n1. first\n2. second\n\nRun `npm test`.");
    expect(html).toContain("<em>care</em>");
    expect(html).toContain("<strong>patience</strong>");
    expect(html).toMatch(/<ul[^>]*>\s*<li>one<\/li>\s*<li>two<\/li>\s*<\/ul>/);
    expect(html).toMatch(/<ol[^>]*>\s*<li>first<\/li>/);
    expect(html).toMatch(/<code[^>]*>npm test<\/code>/);
  });

  it("keeps http(s) and mailto links, each with rel nofollow ugc noopener noreferrer", () => {
    const html = render("[notes](https://notes.example/bring-up) and [write](mailto:bench@example.org) and [home](/listings)");
    const links = tagsNamed(html, "a");
    expect(links.map((a) => a.attrs.href)).toEqual(["https://notes.example/bring-up", "mailto:bench@example.org", "/listings"]);
    for (const a of links) expect(a.attrs.rel).toBe("nofollow ugc noopener noreferrer");
  });

  it("never renders an h1: headings shift down one level", () => {
    const html = render("# Winding\n\n## Layers\n\n###### Deepest");
    expect(tagsNamed(html, "h1")).toEqual([]);
    expect(html).toMatch(/<h2[^>]*>Winding<\/h2>/);
    expect(html).toMatch(/<h3[^>]*>Layers<\/h3>/);
    expect(html).toMatch(/<h6[^>]*>Deepest<\/h6>/);
  });
});

describe("Markdown images", () => {
  const uploads = "https://uploads.fluxyard.test";

  it("allows root-relative paths and the named uploads origin only", () => {
    const html = render(
      [
        "![local](/demo/board.png)",
        `![upload](${uploads}/f/abc.jpg)`,
        "![other](https://elsewhere.example/a.png)",
        "![protocol-relative](//elsewhere.example/a.png)",
        "![relative](board.png)",
      ].join("\n\n"),
      [uploads],
    );
    expect(tagsNamed(html, "img").map((img) => img.attrs.src)).toEqual(["/demo/board.png", `${uploads}/f/abc.jpg`]);
    expect(html).not.toContain("elsewhere.example");
  });

  it("allows no absolute origin when none is given", () => {
    const html = render(`![upload](${uploads}/f/abc.jpg)`);
    expect(tagsNamed(html, "img")).toEqual([]);
  });
});

// Resolution follows the WHATWG URL Standard, which is what browsers apply to these strings.
describe("URL filters", () => {
  it("safeImageSrc treats backslash and protocol-relative forms as other hosts", () => {
    expect(safeImageSrc("/\\elsewhere.example/a.png", [])).toBeUndefined();
    expect(safeImageSrc("//elsewhere.example/a.png", [])).toBeUndefined();
    expect(safeImageSrc("/uploads/a.png", [])).toBe("/uploads/a.png");
    expect(safeImageSrc("http://uploads.test:4000/a.png", ["http://uploads.test:4000"])).toBe("http://uploads.test:4000/a.png");
    // Same host, other port: a different origin.
    expect(safeImageSrc("http://uploads.test:5000/a.png", ["http://uploads.test:4000"])).toBeUndefined();
  });

  it("safeHref refuses schemes other than http, https and mailto", () => {
    expect(safeHref("java\tscript:alert(1)")).toBeUndefined();
    expect(safeHref("data:text/html,<b>x</b>")).toBeUndefined();
    expect(safeHref("file:///etc/passwd")).toBeUndefined();
    expect(safeHref("#section")).toBe("#section");
    expect(safeHref("https://notes.example/")).toBe("https://notes.example/");
  });
});
