import type { InputHTMLAttributes, SelectHTMLAttributes, TextareaHTMLAttributes } from "react";
import { cx } from "./cx";

// The grain border keeps 3:1 against paper (WCAG 2.2 §1.4.11); an invalid control turns berry.
export const controlClasses =
  "block w-full rounded-knot border-2 border-grain bg-paper px-3 py-2 text-body text-ink " +
  "placeholder:text-bark disabled:cursor-not-allowed disabled:bg-sawdust " +
  "aria-[invalid=true]:border-berry";

export function Input({ className, ...rest }: InputHTMLAttributes<HTMLInputElement>) {
  return <input className={cx(controlClasses, "min-h-11", className)} {...rest} />;
}

export function Textarea({ className, ...rest }: TextareaHTMLAttributes<HTMLTextAreaElement>) {
  return <textarea className={cx(controlClasses, className)} {...rest} />;
}

export function Select({ className, ...rest }: SelectHTMLAttributes<HTMLSelectElement>) {
  return <select className={cx(controlClasses, "min-h-11", className)} {...rest} />;
}
