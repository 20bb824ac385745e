import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import fontkit from "@pdf-lib/fontkit";

/**
 * The typeface Kerfline ships for what it renders on the server (annotated PNGs, the PDF
 * report): DejaVu Sans from the dejavu-fonts-ttf package, a free licence that allows
 * embedding. Chosen for its coverage of the trade's symbols (µ, Ω, ±, ×, °, Greek).
 */

export type AppFontFace = "regular" | "bold";

const FILES: Record<AppFontFace, string> = { regular: "DejaVuSans.ttf", bold: "DejaVuSans-Bold.ttf" };

/** The face's family name, as SVG text asks for it. */
export const APP_FONT_FAMILY = "DejaVu Sans";

/** Path of a face's TrueType file (resolved from the working directory: the app's root). */
function appFontPath(face: AppFontFace): string {
  return path.join(/*turbopackIgnore: true*/ process.cwd(), "node_modules", "dejavu-fonts-ttf", "ttf", FILES[face]);
}

/**
 * Points the fontconfig inside sharp at lib/fonts/fonts.conf, so SVG text finds the shipped
 * face whatever fonts the system has. Must run before sharp renders its first text; a
 * FONTCONFIG_FILE set by the operator wins.
 */
export function applyAppFontsForSvg(): void {
  const conf = path.join(/*turbopackIgnore: true*/ process.cwd(), "lib", "fonts", "fonts.conf");
  // Started from elsewhere, keep the system's configuration rather than point at nothing.
  if (process.env.FONTCONFIG_FILE === undefined && existsSync(conf)) process.env.FONTCONFIG_FILE = conf;
}

const bytes = new Map<AppFontFace, Buffer>();

/** The face's TrueType bytes, read once. */
export function appFontBytes(face: AppFontFace): Buffer {
  let b = bytes.get(face);
  if (!b) {
    b = readFileSync(appFontPath(face));
    bytes.set(face, b);
  }
  return b;
}

type Metrics = { unitsPerEm: number; layout(text: string): { advanceWidth: number } };
const metrics = new Map<AppFontFace, Metrics>();

/** Advance width of `text` set at `sizePx` in the app's face, shaped as a text engine would. */
export function textWidthPx(text: string, sizePx: number, face: AppFontFace = "regular"): number {
  let m = metrics.get(face);
  if (!m) {
    m = fontkit.create(appFontBytes(face)) as unknown as Metrics;
    metrics.set(face, m);
  }
  return (m.layout(text).advanceWidth * sizePx) / m.unitsPerEm;
}
