// The HTTP server of a production Kerfline web process: Next.js's own request handler, with
// one fast path in front of it for tile reads (see DEVELOPERS.md, "Serving tiles"). A tile a
// full check through the Next.js route approved for this session a moment ago is answered here
// without routing, session decoding or database queries; everything else goes to Next.js.
//   node scripts/serve.mjs  (PORT, KERFLINE_KEEP_ALIVE_MS; the rest as `next start`)
import http from "node:http";
import path from "node:path";
import next from "next";

const ROOT = path.resolve(import.meta.dirname, "..");
const port = Number(process.env.PORT || 3000);
const app = next({ dev: false, dir: ROOT, port, hostname: "localhost" });
const handle = app.getRequestHandler();
await app.prepare();

const server = http.createServer((req, res) => {
  // Installed by the app at start (server/http/fast-tiles.ts), in the app's own module graph.
  const fast = globalThis.__kerflineFastTiles;
  if (fast && fast(req, res)) return;
  void handle(req, res);
});
// A long keep-alive: with Node's 5 s default a client reusing a socket the server had just
// closed gets ECONNRESET (seen on 100 parallel sign-ins in the tests).
server.keepAliveTimeout = Number(process.env.KERFLINE_KEEP_ALIVE_MS || 65_000);
server.headersTimeout = server.keepAliveTimeout + 5_000;
server.listen(port, () => console.log(`[kerfline] listening on port ${port}`));

let closing = false;
for (const sig of ["SIGINT", "SIGTERM"]) {
  process.on(sig, () => {
    if (closing) return;
    closing = true;
    server.close(() => process.exit(0));
    server.closeIdleConnections();
    // Requests still running after this long (a stuck upload) do not hold the exit.
    setTimeout(() => process.exit(0), 5_000).unref();
  });
}
