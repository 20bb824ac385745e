import { describe, expect, it } from "vitest";
import sharp from "sharp";
import { configureSharp } from "@/server/images/limits";
import { APP_FONT_FAMILY, textWidthPx } from "./app-fonts";

// Our widths come from fontkit's shaping of the shipped TTF; the check is librsvg/Pango setting
// the same family by name through sharp, with the app's fontconfig file in effect.
async function rightmostInk(text: string): Promise<number> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="160"><text x="10" y="130" font-size="100" font-family="${APP_FONT_FAMILY}" fill="#fff">${text}</text></svg>`;
  const { data, info } = await sharp(Buffer.from(svg)).raw().toBuffer({ resolveWithObject: true });
  let right = -1;
  for (let y = 0; y < info.height; y++)
    for (let x = 0; x < info.width; x++) if (data[(y * info.width + x) * info.channels + 3] > 128) right = Math.max(right, x);
  return right;
}

describe("textWidthPx", () => {
  // Pango places glyphs on whole pixels, so each advance may differ by up to 1 px from the exact one.
  it("matches the advances librsvg lays out for the same face (±1 px a glyph)", async () => {
    configureSharp();
    // Four more H's move the last glyph's ink right by exactly four advances.
    const moved = (await rightmostInk("HHHHH")) - (await rightmostInk("H"));
    expect(Math.abs(moved - 4 * textWidthPx("H", 100))).toBeLessThanOrEqual(4);
    const digits = (await rightmostInk("P8888")) - (await rightmostInk("P"));
    expect(Math.abs(digits - textWidthPx("8888", 100))).toBeLessThanOrEqual(4);
  });

  it("scales linearly with the size and is wider for bold", () => {
    expect(textWidthPx("VREF", 20)).toBeCloseTo(textWidthPx("VREF", 10) * 2, 9);
    expect(textWidthPx("VREF", 10, "bold")).toBeGreaterThan(textWidthPx("VREF", 10));
  });
});
