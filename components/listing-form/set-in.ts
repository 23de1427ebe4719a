/** An immutable update at a dotted path ("figures.windings.0.turns"); arrays stay arrays. */
export function setIn<T>(target: T, path: string, value: unknown): T {
  const [head, ...rest] = path.split(".");
  if (head === undefined) return target;
  const container = target as unknown as Record<string, unknown> | unknown[];
  const current = (container as Record<string, unknown>)[head];
  const next = rest.length === 0 ? value : setIn(current, rest.join("."), value);
  if (Array.isArray(container)) {
    const copy = [...container];
    copy[Number(head)] = next;
    return copy as unknown as T;
  }
  return { ...(container as Record<string, unknown>), [head]: next } as T;
}
