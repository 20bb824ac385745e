"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import "./zod-jitless";

/** One TanStack Query client per browser tab. */
export function QueryProvider({ children }: { children: React.ReactNode }) {
  // Marks the page as hydrated (effects run children first, so the tree below is live): tests
  // wait for it after a full page load instead of clicking a button that is not wired yet.
  useEffect(() => {
    document.documentElement.dataset.hydrated = "true";
  }, []);
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 10_000, retry: 1, refetchOnWindowFocus: false } } }));
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
