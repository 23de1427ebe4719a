import type { ComponentProps, ReactNode } from "react";
import ReactMarkdown, { type Components } from "react-markdown";
import rehypeSanitize, { defaultSchema, type Options as SanitizeSchema } from "rehype-sanitize";
import { cx } from "@/components/ui/cx";

/*
 * The one renderer for text people write: listing descriptions, safety notes, log entries,
 * Q&A, review reports. Three layers, each enough on its own for what it guards:
 *   1. Raw HTML in the Markdown is never parsed as HTML (no rehype-raw): it is shown as the text
 *      it is, so "<script>…" reads as typed and "measure between <TP3> and <GND>" loses nothing.
 *      `skipHtml` stays on behind it.
 *   2. rehype-sanitize with GitHub's schema narrowed to what Markdown itself produces.
 *   3. `urlTransform`: links only http/https/mailto or same-site; images only same-site paths
 *      or the origins the caller names (the uploads host).
 */

const LINK_REL = "nofollow ugc noopener noreferrer";

type MdNode = { type: string; value?: string; children?: MdNode[] };

// Containers whose children are blocks (mdast "flow content"), where an HTML block sits.
const FLOW_PARENTS = new Set(["root", "blockquote", "listItem", "footnoteDefinition"]);

function textLines(value: string): MdNode[] {
  return value.split(/\r?\n/).flatMap((line, i) => (i === 0 ? [{ type: "text", value: line }] : [{ type: "break" }, { type: "text", value: line }]));
}

/**
 * A remark plugin: every raw-HTML node (CommonMark §4.6 HTML blocks, §6.6 raw inline HTML) becomes
 * plain text, an HTML block a paragraph of it with its line breaks kept.
 */
function rawHtmlAsText() {
  const walk = (node: MdNode) => {
    if (!node.children) return;
    node.children = node.children.map((child) => {
      if (child.type !== "html") {
        walk(child);
        return child;
      }
      const value = child.value ?? "";
      return FLOW_PARENTS.has(node.type) ? { type: "paragraph", children: textLines(value) } : { type: "text", value };
    });
  };
  return (tree: MdNode) => walk(tree);
}

// Base used only to tell relative URLs from absolute ones; `.invalid` can never resolve.
const RELATIVE_BASE = "https://relative.invalid";

const schema: SanitizeSchema = {
  ...defaultSchema,
  tagNames: [
    "a", "blockquote", "br", "code", "del", "em", "h1", "h2", "h3", "h4", "h5", "h6", "hr", "img",
    "li", "ol", "p", "pre", "strong", "table", "tbody", "td", "th", "thead", "tr", "ul",
  ],
  attributes: {
    a: ["href", "title"],
    code: [["className", /^language-[\w-]+$/]],
    img: ["src", "alt", "title"],
    ol: ["start"],
    td: ["align"],
    th: ["align"],
  },
  protocols: {
    href: ["http", "https", "mailto"],
    src: ["http", "https"],
  },
  // Markdown can produce neither, but a later plugin might: drop them with their content.
  strip: ["script", "style"],
};

function parse(url: string): URL | undefined {
  try {
    return new URL(url, RELATIVE_BASE);
  } catch {
    return undefined;
  }
}

/** Link targets people may write: web, e-mail, and paths or fragments on this site. */
export function safeHref(url: string): string | undefined {
  const parsed = parse(url.trim());
  if (!parsed) return undefined;
  if (parsed.origin === RELATIVE_BASE) return url.trim();
  return ["http:", "https:", "mailto:"].includes(parsed.protocol) ? url.trim() : undefined;
}

/**
 * Image sources: a root-relative path on this site, or an absolute http(s) URL on one of the
 * allowed origins. The WHATWG parser decides, so `//host`, `/\host` and tab tricks resolve the
 * way a browser would resolve them.
 */
export function safeImageSrc(url: string, allowedOrigins: readonly string[]): string | undefined {
  const trimmed = url.trim();
  const parsed = parse(trimmed);
  if (!parsed) return undefined;
  if (parsed.origin === RELATIVE_BASE) return trimmed.startsWith("/") ? trimmed : undefined;
  if (parsed.protocol !== "http:" && parsed.protocol !== "https:") return undefined;
  const origins = allowedOrigins.flatMap((origin) => {
    const o = parse(origin);
    return o && o.origin !== RELATIVE_BASE ? [o.origin] : [];
  });
  return origins.includes(parsed.origin) ? parsed.href : undefined;
}

type HeadingLevel = 1 | 2 | 3 | 4 | 5 | 6;

const headingClasses: Record<HeadingLevel, string> = {
  1: "mt-8 mb-3 text-3xl font-semibold",
  2: "mt-8 mb-3 text-2xl font-semibold",
  3: "mt-6 mb-2 text-xl font-semibold",
  4: "mt-5 mb-2 text-lg font-semibold",
  5: "mt-4 mb-1 text-base font-semibold",
  6: "mt-4 mb-1 text-base font-semibold text-graphite-700",
};

function heading(level: HeadingLevel, minLevel: HeadingLevel) {
  const shifted = Math.min(6, level + minLevel - 1) as HeadingLevel;
  const Tag = `h${shifted}` as const;
  return function Heading({ children }: { children?: ReactNode }) {
    return <Tag className={cx("text-graphite-900 first:mt-0", headingClasses[shifted])}>{children}</Tag>;
  };
}

function buildComponents(minLevel: HeadingLevel): Components {
  return {
    h1: heading(1, minLevel),
    h2: heading(2, minLevel),
    h3: heading(3, minLevel),
    h4: heading(4, minLevel),
    h5: heading(5, minLevel),
    h6: heading(6, minLevel),
    p: ({ children }) => <p className="my-3 first:mt-0 last:mb-0">{children}</p>,
    a: ({ href, title, children }) =>
      // A link whose target was removed stays readable as text rather than as a dead link.
      href ? (
        <a href={href} title={title} rel={LINK_REL}>
          {children}
        </a>
      ) : (
        <span>{children}</span>
      ),
    img: ({ src, alt, title }) =>
      typeof src === "string" && src !== "" ? (
        // Plain <img>: user images come from the uploads host at sizes we do not know.
        // eslint-disable-next-line @next/next/no-img-element
        <img src={src} alt={alt ?? ""} title={title} loading="lazy" className="my-3 h-auto max-w-full rounded" />
      ) : (
        <span className="text-graphite-600">[image not shown{alt ? `: ${alt}` : ""}]</span>
      ),
    ul: ({ children }) => <ul className="my-3 list-disc space-y-1 pl-6">{children}</ul>,
    ol: ({ children, start }) => (
      <ol start={start} className="my-3 list-decimal space-y-1 pl-6">
        {children}
      </ol>
    ),
    blockquote: ({ children }) => (
      <blockquote className="my-3 border-l-4 border-graphite-300 pl-4 text-graphite-700">{children}</blockquote>
    ),
    code: ({ className, children }) => (
      <code className={cx("rounded-sm bg-paper-sunken px-1 font-mono text-[0.9em]", className)}>{children}</code>
    ),
    pre: ({ children }) => (
      <pre className="my-3 overflow-x-auto rounded bg-graphite-900 p-3 font-mono text-sm text-paper [&_code]:bg-transparent [&_code]:p-0">
        {children}
      </pre>
    ),
    hr: () => <hr className="my-6 border-graphite-200" />,
  };
}

// Built once per level so component identities stay stable across renders.
const componentsByLevel = { 2: buildComponents(2), 3: buildComponents(3), 4: buildComponents(4) } as const;

export type MarkdownProps = {
  children: string;
  /** Origins images may load from, e.g. the uploads host; root-relative paths are always allowed. */
  imageOrigins?: readonly string[];
  /** The highest heading the content may render; pages own their h1, so at least 2. */
  minHeadingLevel?: 2 | 3 | 4;
  className?: string;
} & Pick<ComponentProps<"div">, "id">;

export function Markdown({ children, imageOrigins = [], minHeadingLevel = 2, className, id }: MarkdownProps) {
  return (
    <div id={id} className={cx("max-w-reading break-words text-graphite-900", className)}>
      <ReactMarkdown
        skipHtml
        remarkPlugins={[rawHtmlAsText]}
        rehypePlugins={[[rehypeSanitize, schema]]}
        urlTransform={(url, key, node) => {
          if (key === "src" && node.tagName === "img") return safeImageSrc(url, imageOrigins);
          if (key === "href") return safeHref(url);
          // Any other URL attribute (cite, longDesc…) is not in our schema; refuse it if it shows up.
          return undefined;
        }}
        components={componentsByLevel[minHeadingLevel]}
      >
        {children}
      </ReactMarkdown>
    </div>
  );
}
