import type { Metadata } from "next";
import { connection } from "next/server";
import "./globals.css";
import { inter } from "./fonts";
import { QueryProvider } from "@/components/ui/query-provider";

export const metadata: Metadata = {
  title: { default: "Kerfline", template: "%s · Kerfline" },
  description: "Read integrated-circuit dies from micrographs: mark, review, align, measure, hand over.",
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page is rendered per request so Next.js can put the proxy's CSP nonce on its scripts
  // (a page prerendered at build would carry none and its scripts would be refused).
  await connection();
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-screen font-sans antialiased">
        <QueryProvider>{children}</QueryProvider>
      </body>
    </html>
  );
}
