import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // PGlite ships wasm and data files: keep it external so they are not copied into the
  // publicly served static folder (see DEVELOPERS.md).
  serverExternalPackages: ["@electric-sql/pglite", "sharp", "pg", "smtp-server", "mailparser", "nodemailer"],
  // A separate build folder per checkout user (KERFLINE_DIST_DIR) lets parallel work build and
  // serve without replacing each other's running build. Defaults to Next's own ".next".
  distDir: process.env.KERFLINE_DIST_DIR || ".next",
  poweredByHeader: false,
  reactStrictMode: true,
  // Types are checked by `npm run check:types` (part of `npm test`), once for the whole tree.
  typescript: { ignoreBuildErrors: true },
};

export default nextConfig;
