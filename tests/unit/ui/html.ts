// A tiny reader for renderToStaticMarkup output, which is regular enough for regexes:
// attributes always double-quoted, entities escaped. Saves a DOM dependency in unit tests.
export type Tag = { name: string; attrs: Record<string, string> };

export function tags(html: string): Tag[] {
  const found: Tag[] = [];
  for (const match of html.matchAll(/<([a-zA-Z][\w-]*)((?:\s+[^\s=>]+(?:="[^"]*")?)*)\s*\/?>/g)) {
    const attrs: Record<string, string> = {};
    for (const attr of (match[2] ?? "").matchAll(/([^\s=>]+)(?:="([^"]*)")?/g)) {
      attrs[attr[1] ?? ""] = attr[2] ?? "";
    }
    found.push({ name: (match[1] ?? "").toLowerCase(), attrs });
  }
  return found;
}

export function tagsNamed(html: string, name: string): Tag[] {
  return tags(html).filter((tag) => tag.name === name);
}

/** Text content of the element with this id (no nesting of the same tag assumed). */
export function textOfId(html: string, id: string): string | undefined {
  const match = new RegExp(`<([a-zA-Z][\\w-]*)[^>]*\\sid="${id}"[^>]*>([\\s\\S]*?)</\\1>`).exec(html);
  return match?.[2]?.replace(/<[^>]+>/g, "");
}
