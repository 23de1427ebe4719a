import type { FormErrors, FormValues } from "./form-model";

/** What every section gets: the values, a setter by path, and the errors by path. */
export type SectionProps = {
  values: FormValues;
  set: (path: string, value: unknown) => void;
  errors: FormErrors;
  /** the listing already exists: its kind can no longer change */
  editing: boolean;
};
