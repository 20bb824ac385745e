import localFont from "next/font/local";

// Shipped with the app from the fontsource package: no network at build or run time.
export const inter = localFont({
  src: [{ path: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2", style: "normal" }],
  variable: "--font-inter",
  display: "swap",
});
