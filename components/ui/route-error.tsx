"use client";

import { useEffect, useRef } from "react";
import { Button } from "./button";

/** What Next hands a route's error.tsx. */
type RouteErrorProps = { error: unknown; retry: () => void };

/**
 * A route's error page: says the page could not be shown and offers to try again. `retry`
 * fetches the page's server data again and re-renders it (clearing the boundary alone would
 * show the same failed render). Server errors reach the browser without their text, so the
 * digest is shown as the reference to quote; focus moves to the heading so a screen reader
 * or keyboard user starts at the message.
 */
export function RouteError({ error, retry }: RouteErrorProps) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    heading.current?.focus();
    console.error(error);
  }, [error]);
  const digest = typeof error === "object" && error !== null && "digest" in error && typeof error.digest === "string" ? error.digest : null;
  return (
    <div className="flex flex-col items-center justify-center gap-4 py-16 text-center">
      <div role="alert" className="space-y-2">
        <h1 ref={heading} tabIndex={-1} className="text-xl font-semibold text-ink-100 focus:outline-none">
          This page could not be loaded
        </h1>
        <p className="max-w-md text-sm text-ink-300">Something went wrong while reading it. Your work is saved; trying again usually helps.</p>
        {digest && <p className="text-xs text-ink-400">Reference: {digest}</p>}
      </div>
      <Button variant="primary" onClick={() => retry()}>
        Try again
      </Button>
    </div>
  );
}
