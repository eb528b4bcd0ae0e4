"use client";
import { useEffect } from "react";

/**
 * Sets <html data-hydrated> once React has attached to the server's HTML: until then a button's handler
 * does nothing, so the browser tests wait for it before they act, and the stylesheet shows controls that
 * need script as disabled until it is there.
 */
export function HydrationMark() {
  useEffect(() => {
    document.documentElement.dataset.hydrated = "true";
  }, []);
  return null;
}
