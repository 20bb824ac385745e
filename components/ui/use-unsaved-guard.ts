"use client";

import { useEffect } from "react";

/**
 * While `dirty`, leaving or reloading the page asks first (the browser's own "leave site?"
 * prompt, through beforeunload). Each caller guards its own unsaved state; the listener is
 * there only while that state is unsaved, so a clean page leaves without a question.
 */
export function useUnsavedGuard(dirty: boolean): void {
  useEffect(() => {
    if (!dirty) return;
    const ask = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      // Older Chromium builds still need returnValue set to show the prompt.
      e.returnValue = "";
    };
    window.addEventListener("beforeunload", ask);
    return () => window.removeEventListener("beforeunload", ask);
  }, [dirty]);
}
