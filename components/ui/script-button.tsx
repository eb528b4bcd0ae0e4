"use client";
import { useSyncExternalStore, type ButtonHTMLAttributes } from "react";

const noSubscription = () => () => undefined;

/** False while the server renders and while React hydrates the page, true from then on. */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
}

/** A button that, when it needs the page's script, is disabled until the page has hydrated (see Button). */
export function ScriptButton({
  needsScript,
  disabled,
  ...rest
}: ButtonHTMLAttributes<HTMLButtonElement> & { needsScript?: boolean }) {
  const hydrated = useHydrated();
  const waiting = (needsScript ?? rest.onClick !== undefined) && !hydrated;
  return <button disabled={disabled || waiting} {...rest} />;
}
