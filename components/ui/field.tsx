import type { InputHTMLAttributes, ReactNode } from "react";
import { Input } from "./input";

/** The attributes a control needs so its label, hint and error are announced with it. */
export type ControlProps = {
  id: string;
  "aria-describedby"?: string;
  "aria-invalid"?: true;
};

export type FieldProps = {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  required?: boolean;
  children: (control: ControlProps) => ReactNode;
};

/** Label, optional hint, the control (rendered by the caller) and an error message under it. */
export function Field({ id, label, hint, error, required, children }: FieldProps) {
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="font-semibold text-ink">
        {label}
        {required ? <span className="ml-1 text-small font-normal text-bark">(required)</span> : null}
      </label>
      {hint ? (
        <p id={hintId} className="text-small text-bark">
          {hint}
        </p>
      ) : null}
      {children({ id, "aria-describedby": describedBy, "aria-invalid": error ? true : undefined })}
      {error ? (
        <p id={errorId} className="text-small font-semibold text-berry">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export type TextFieldProps = Omit<InputHTMLAttributes<HTMLInputElement>, "id"> & {
  name: string;
  label: ReactNode;
  id?: string;
  hint?: ReactNode;
  error?: string;
};

/** The common case: a labelled text input whose id defaults to its name. */
export function TextField({ id, name, label, hint, error, required, ...inputProps }: TextFieldProps) {
  const fieldId = id ?? name;
  return (
    <Field id={fieldId} label={label} hint={hint} error={error} required={required}>
      {(control) => <Input name={name} required={required} {...inputProps} {...control} />}
    </Field>
  );
}
