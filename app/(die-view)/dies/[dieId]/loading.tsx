/** Shown below the die's header while the workspace is rendered on the server. */
export default function DieLoading() {
  return (
    <div className="flex min-h-0 flex-1" aria-busy="true">
      <section className="flex min-w-0 flex-1 items-center justify-center bg-ink-950">
        <p role="status" className="text-sm text-ink-400">
          Loading die…
        </p>
      </section>
      <div aria-hidden="true" className="w-80 shrink-0 animate-pulse border-l border-ink-800 bg-ink-900" />
    </div>
  );
}
