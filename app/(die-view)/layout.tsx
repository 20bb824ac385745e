/** The full-screen die view: viewer and markup get the whole window, with their own chrome. */
export default function DieViewLayout({ children }: { children: React.ReactNode }) {
  return <div className="flex h-screen flex-col overflow-hidden bg-ink-950">{children}</div>;
}
