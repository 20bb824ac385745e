import type { NextConfig } from "next";
import { API_CONTENT_SECURITY_POLICY, COMMON_SECURITY_HEADERS } from "./lib/http/security-headers";

const common = Object.entries(COMMON_SECURITY_HEADERS).map(([key, value]) => ({ key, value }));

const nextConfig: NextConfig = {
  // PGlite ships wasm and data files: keep it external so they are not copied into the
  // publicly served static folder (see DEVELOPERS.md).
  serverExternalPackages: ["@electric-sql/pglite", "sharp", "pg", "smtp-server", "mailparser", "nodemailer", "@tus/server", "@tus/file-store", "@tus/s3-store"],
  // A separate build folder per checkout user (KERFLINE_DIST_DIR) lets parallel work build and
  // serve without replacing each other's running build. Defaults to Next's own ".next".
  distDir: process.env.KERFLINE_DIST_DIR || ".next",
  poweredByHeader: false,
  reactStrictMode: true,
  // Pages get these and a nonce policy from proxy.ts; everything else (API, tiles, static
  // files) gets them here. The PDF report keeps no policy: Chromium's viewer obeys it and
  // would show nothing under default-src 'none'.
  async headers() {
    return [
      { source: "/:path*", headers: common },
      { source: "/api/:path((?!.*\\.pdf$).*)", headers: [{ key: "Content-Security-Policy", value: API_CONTENT_SECURITY_POLICY }] },
    ];
  },
  // Types are checked by `npm run check:types` (part of `npm test`), once for the whole tree.
  typescript: { ignoreBuildErrors: true },
};

export default nextConfig;
