"use client";

import { Button } from "@/components/ui/button";

/** The die workspace failed to render: the reason as the server or the browser gave it, and a way to try again. */
export default function DieError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="flex min-h-0 flex-1 items-center justify-center p-6">
      <div role="alert" className="flex max-w-md flex-col items-center gap-3 text-center">
        <h2 className="text-base font-semibold text-ink-100">The die could not be shown</h2>
        <p className="text-sm text-ink-300">{error.message || "Something went wrong."}</p>
        <Button variant="primary" onClick={() => reset()}>
          Try again
        </Button>
      </div>
    </div>
  );
}
