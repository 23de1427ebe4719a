import { useEffect, useState } from "react";

/** The value once it has stopped changing for `delayMs`, so a live check does not fire on every keystroke. */
export function useDebouncedValue<T>(value: T, delayMs = 400): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(timer);
  }, [value, delayMs]);
  return settled;
}
