import type { Metadata } from "next";
import "./globals.css";
import { inter } from "./fonts";
import { QueryProvider } from "@/components/ui/query-provider";

export const metadata: Metadata = {
  title: { default: "Kerfline", template: "%s · Kerfline" },
  description: "Read integrated-circuit dies from micrographs: mark, review, align, measure, hand over.",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-screen font-sans antialiased">
        <QueryProvider>{children}</QueryProvider>
      </body>
    </html>
  );
}
