/**
 * Grey bars shaped like a page's heading and rows, shown while a route's server data loads.
 * Only for pages that never answer 404 (the case list, inbox, account, settings): a loading
 * boundary makes Next stream the page, so the 200 status is sent before a page's notFound()
 * could set 404, and an outsider opening a case, team or the mailbox would get a 200.
 */
export function PageSkeleton() {
  return (
    <div className="space-y-4" aria-busy="true">
      <p role="status" className="sr-only">
        Loading…
      </p>
      <div aria-hidden="true" className="space-y-4 motion-safe:animate-pulse">
        <div className="h-7 w-64 rounded bg-ink-800" />
        <div className="h-4 w-96 max-w-full rounded bg-ink-800/70" />
        <div className="space-y-2 pt-2">
          {[0, 1, 2, 3, 4].map((i) => (
            <div key={i} className="h-10 rounded bg-ink-900" />
          ))}
        </div>
      </div>
    </div>
  );
}
