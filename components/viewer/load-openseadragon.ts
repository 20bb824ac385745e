import type { OsdNamespace } from "./viewer-api";

/**
 * Loads OpenSeadragon in the browser. It touches `document` while its module is evaluated,
 * so it must never be imported at the top level of anything that also renders on the server.
 */
export async function loadOpenSeadragon(): Promise<OsdNamespace> {
  const mod = await import("openseadragon");
  // The package is UMD: bundlers expose it as the default export, but be lenient.
  return (mod as { default?: OsdNamespace }).default ?? (mod as unknown as OsdNamespace);
}
