// Child process for the benchmark: tiles one image with Kerfline's pyramid builder and prints
// its wall time and peak RSS (libvips runs in this process, so maxRSS includes it).
import { buildPyramid } from "@/server/images/pyramid";

const [input, out] = process.argv.slice(2);
const t0 = performance.now();
await buildPyramid(input, out, { pollMs: 1000 });
const seconds = (performance.now() - t0) / 1000;
console.log(JSON.stringify({ seconds, peakRssMb: process.resourceUsage().maxRSS / 1024 }));
