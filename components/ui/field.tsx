import { useId, type ComponentProps, type ReactNode } from "react";
import { cx } from "./cx";

/** What every field takes besides its control's own props. `error` accepts zod's string[]. */
export type FieldProps = {
  label: ReactNode;
  hint?: ReactNode;
  error?: string | readonly string[];
  id?: string;
};

type FieldIds = { id: string; hintId: string; errorId: string; unitId: string };

function useFieldIds(id: string | undefined): FieldIds {
  const auto = useId();
  const base = id ?? `field${auto.replace(/[^A-Za-z0-9_-]/g, "")}`;
  return { id: base, hintId: `${base}-hint`, errorId: `${base}-error`, unitId: `${base}-unit` };
}

function errorText(error: FieldProps["error"]): string | undefined {
  const text = typeof error === "string" ? error : error?.join(" ");
  return text && text.trim() !== "" ? text : undefined;
}

// Screen readers read the hint and the error right after the label, in that order.
function describedBy(...ids: Array<string | false | undefined>): string | undefined {
  const joined = ids.filter(Boolean).join(" ");
  return joined === "" ? undefined : joined;
}

const controlBase =
  "block w-full rounded border bg-paper-raised px-3 text-graphite-900 shadow-inset " +
  "placeholder:text-graphite-500 disabled:bg-graphite-50 disabled:text-graphite-600";

function controlClasses(invalid: boolean): string {
  return cx(controlBase, invalid ? "border-signal-700 border-2" : "border-graphite-300 hover:border-graphite-400");
}

function Label({ htmlFor, required, children }: { htmlFor: string; required?: boolean; children: ReactNode }) {
  return (
    <label htmlFor={htmlFor} className="block text-sm font-semibold text-graphite-900">
      {children}
      {/* The control's own `required` is what assistive tech announces; this is for the eye. */}
      {required ? (
        <span aria-hidden="true" className="font-normal text-graphite-600">
          {" "}
          (required)
        </span>
      ) : null}
    </label>
  );
}

function Hint({ id, children }: { id: string; children: ReactNode }) {
  return (
    <p id={id} className="text-sm text-graphite-600">
      {children}
    </p>
  );
}

function ErrorLine({ id, text }: { id: string; text: string }) {
  return (
    <p id={id} className="text-sm font-medium text-signal-700">
      {text}
    </p>
  );
}

type Wired = { ids: FieldIds; error: string | undefined; describedBy: string | undefined };

function useWiring(props: FieldProps, withUnit = false): Wired {
  const ids = useFieldIds(props.id);
  const error = errorText(props.error);
  return {
    ids,
    error,
    describedBy: describedBy(withUnit && ids.unitId, props.hint != null && ids.hintId, error !== undefined && ids.errorId),
  };
}

function Shell({ wired, props, required, children }: { wired: Wired; props: FieldProps; required?: boolean; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1.5">
      <Label htmlFor={wired.ids.id} required={required}>
        {props.label}
      </Label>
      {props.hint != null ? <Hint id={wired.ids.hintId}>{props.hint}</Hint> : null}
      {children}
      {wired.error !== undefined ? <ErrorLine id={wired.ids.errorId} text={wired.error} /> : null}
    </div>
  );
}

export type TextFieldProps = FieldProps & Omit<ComponentProps<"input">, "id">;

export function TextField({ label, hint, error, id, className, type = "text", ...input }: TextFieldProps) {
  const props = { label, hint, error, id };
  const wired = useWiring(props);
  return (
    <Shell wired={wired} props={props} required={input.required}>
      <input
        {...input}
        type={type}
        id={wired.ids.id}
        aria-invalid={wired.error !== undefined ? true : undefined}
        aria-describedby={describedBy(wired.describedBy, input["aria-describedby"])}
        className={cx(controlClasses(wired.error !== undefined), "h-10", className)}
      />
    </Shell>
  );
}

export type TextAreaProps = FieldProps & Omit<ComponentProps<"textarea">, "id">;

export function TextArea({ label, hint, error, id, className, rows = 6, ...textarea }: TextAreaProps) {
  const props = { label, hint, error, id };
  const wired = useWiring(props);
  return (
    <Shell wired={wired} props={props} required={textarea.required}>
      <textarea
        {...textarea}
        rows={rows}
        id={wired.ids.id}
        aria-invalid={wired.error !== undefined ? true : undefined}
        aria-describedby={describedBy(wired.describedBy, textarea["aria-describedby"])}
        className={cx(controlClasses(wired.error !== undefined), "py-2", className)}
      />
    </Shell>
  );
}

export type SelectOption = { value: string; label: string; disabled?: boolean };

export type SelectFieldProps = FieldProps &
  Omit<ComponentProps<"select">, "id"> & {
    options?: readonly SelectOption[];
    /** A first, empty choice such as "Choose a kind"; submitted as "". */
    placeholder?: string;
  };

export function SelectField({ label, hint, error, id, className, options, placeholder, children, ...select }: SelectFieldProps) {
  const props = { label, hint, error, id };
  const wired = useWiring(props);
  return (
    <Shell wired={wired} props={props} required={select.required}>
      <select
        {...select}
        id={wired.ids.id}
        aria-invalid={wired.error !== undefined ? true : undefined}
        aria-describedby={describedBy(wired.describedBy, select["aria-describedby"])}
        className={cx(controlClasses(wired.error !== undefined), "h-10", className)}
      >
        {placeholder !== undefined ? <option value="">{placeholder}</option> : null}
        {options?.map((option) => (
          <option key={option.value} value={option.value} disabled={option.disabled}>
            {option.label}
          </option>
        ))}
        {children}
      </select>
    </Shell>
  );
}

export type CheckboxFieldProps = FieldProps & Omit<ComponentProps<"input">, "id" | "type">;

/** A checkbox with its label beside it; used for acknowledgements such as a safety sheet. */
export function CheckboxField({ label, hint, error, id, className, ...input }: CheckboxFieldProps) {
  const props = { label, hint, error, id };
  const wired = useWiring(props);
  const invalid = wired.error !== undefined;
  return (
    <div className="flex flex-col gap-1.5">
      <div className="flex items-start gap-2">
        <input
          {...input}
          type="checkbox"
          id={wired.ids.id}
          aria-invalid={invalid ? true : undefined}
          aria-describedby={describedBy(wired.describedBy, input["aria-describedby"])}
          className={cx("mt-1 size-4 shrink-0 accent-copper-600", invalid && "outline-2 outline-signal-700", className)}
        />
        <Label htmlFor={wired.ids.id} required={input.required}>
          {label}
        </Label>
      </div>
      {hint != null ? <Hint id={wired.ids.hintId}>{hint}</Hint> : null}
      {wired.error !== undefined ? <ErrorLine id={wired.ids.errorId} text={wired.error} /> : null}
    </div>
  );
}

export type NumberFieldProps = FieldProps &
  Omit<ComponentProps<"input">, "id" | "type"> & {
    /** Unit symbol shown after the input in the mono face, e.g. "µF", "V", "mm". */
    unit?: string;
  };

/**
 * A number with its unit. The unit is part of the accessible description, so "Bulk capacitance,
 * µF" is read even though the unit sits outside the label.
 */
export function NumberField({ label, hint, error, id, className, unit, step = "any", ...input }: NumberFieldProps) {
  const props = { label, hint, error, id };
  const wired = useWiring(props, Boolean(unit));
  const invalid = wired.error !== undefined;
  return (
    <Shell wired={wired} props={props} required={input.required}>
      <div className="flex items-stretch">
        <input
          inputMode="decimal"
          {...input}
          type="number"
          step={step}
          id={wired.ids.id}
          aria-invalid={invalid ? true : undefined}
          aria-describedby={describedBy(wired.describedBy, input["aria-describedby"])}
          className={cx(controlClasses(invalid), "figure h-10 font-mono", unit && "rounded-r-none", className)}
        />
        {unit ? (
          <span
            id={wired.ids.unitId}
            className="inline-flex items-center rounded-r border border-l-0 border-graphite-300 bg-paper-sunken px-3 font-mono text-sm text-graphite-700"
          >
            {unit}
          </span>
        ) : null}
      </div>
    </Shell>
  );
}
