import { useCallback, useState, type ChangeEvent } from "react";

type Control = HTMLInputElement | HTMLSelectElement;

/**
 * A calculator's inputs as the typed text, so "0." or an empty field survive while the person
 * types; parsing happens in the calculator's model on every change.
 */
export function useFormValues<T extends Record<string, string>>(initial: T) {
  const [values, setValues] = useState<T>(initial);

  const set = useCallback((key: keyof T, value: string) => setValues((current) => ({ ...current, [key]: value })), []);

  /** name, value and onChange for a field bound to `key` */
  const bind = (key: keyof T & string) => ({
    name: key,
    value: values[key],
    onChange: (event: ChangeEvent<Control>) => set(key, event.target.value),
  });

  const reset = useCallback(() => setValues(initial), [initial]);

  return { values, set, setValues, bind, reset };
}
