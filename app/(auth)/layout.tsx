import { Wordmark } from "@/components/ui/wordmark";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-6 bg-[radial-gradient(ellipse_at_top,_#1c2126,_#0d0f11_60%)] p-6">
      <Wordmark className="text-2xl" />
      <div className="w-full max-w-sm rounded-xl border border-ink-800 bg-ink-900/90 p-6 shadow-2xl">{children}</div>
      <p className="max-w-sm text-center text-xs text-ink-400">A workspace for reading integrated-circuit dies from micrographs.</p>
    </main>
  );
}
