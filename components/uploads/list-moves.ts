// Pure list edits for the controlled uploaders (the first photo is the cover, so order matters).

/** A copy of `list` with the item at `from` moved to `to`; out-of-range moves change nothing. */
export function moveItem<T>(list: readonly T[], from: number, to: number): T[] {
  if (from === to || from < 0 || to < 0 || from >= list.length || to >= list.length) return [...list];
  const next = [...list];
  const [item] = next.splice(from, 1);
  next.splice(to, 0, item as T);
  return next;
}

export function removeAt<T>(list: readonly T[], index: number): T[] {
  return list.filter((_, i) => i !== index);
}

export function replaceAt<T>(list: readonly T[], index: number, update: (item: T) => T): T[] {
  return list.map((item, i) => (i === index ? update(item) : item));
}
