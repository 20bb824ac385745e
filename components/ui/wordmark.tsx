/** Kerfline's own wordmark: a die outline crossed by a saw cut, then the name. */
export function Wordmark({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-tight ${className}`}>
      <svg aria-hidden="true" viewBox="0 0 32 32" className="h-6 w-6">
        <rect x="7" y="7" width="18" height="18" rx="1.5" fill="none" stroke="currentColor" strokeOpacity="0.7" strokeWidth="2" />
        <path d="M4 26 L28 8" stroke="var(--color-kerf-500)" strokeWidth="3" strokeLinecap="round" />
      </svg>
      <span>
        Kerf<span className="text-kerf-400">line</span>
      </span>
    </span>
  );
}
