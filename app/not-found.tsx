import Link from "next/link";
import { Wordmark } from "@/components/ui/wordmark";

export default function NotFound() {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center gap-4 p-6 text-center">
      <Wordmark className="text-xl" />
      <h1 className="text-2xl font-semibold">Not found</h1>
      <p className="max-w-md text-sm text-ink-300">This page does not exist, or it belongs to a team you are not a member of.</p>
      <Link href="/cases" className="text-sm text-kerf-400 hover:underline">
        Back to your cases
      </Link>
    </main>
  );
}
