import type { Position } from "../geometry/types";
import type { DieLayout, Pad, Trace, WireBond } from "./layout-types";
import { placeDie, type PlacementOptions } from "./placement";
import { spiralPaths } from "./spiral-path";

/**
 * Draws a die layout as an SVG micrograph. Bright field shows reflective metal bright and
 * yellowish on a grey-green passivated substrate; dark field shows only edges, light on
 * near-black, as scattered light does. The die is drawn in µm inside one group whose matrix
 * is the placement's die → image transform, so the picture and the ground-truth transform
 * cannot disagree.
 */

export type Look = "bright_field" | "dark_field";

/** Colours of each look, exported so tests can classify sampled pixels. */
export const PALETTE = {
  bright_field: {
    background: "#2b2824",
    substrate: "#7a8a72",
    block: "#66765f",
    metal: "#e4d59c",
    padOpening: "#f1e7c3",
    underMetal: "#a99f74",
    capPlate: "#c8b985",
    gold: "#d9b24a",
    goldEdge: "#8f6d22",
    scrub: "#b8ae8c",
  },
  dark_field: { background: "#08090a", die: "#101211", edge: "#d8dde0", faint: "#5e6467" },
} as const;

export type RenderSvgOptions = PlacementOptions & { look: Look };

const n = (v: number) => String(Math.round(v * 1000) / 1000);
const pts = (points: readonly Position[]) => points.map(([x, y]) => `${n(x)},${n(y)}`).join(" ");
const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

type Ctx = { look: Look; edge: number };

function polyline(points: readonly Position[], width: number, colour: string, cap = "butt"): string {
  return `<polyline points="${pts(points)}" fill="none" stroke="${colour}" stroke-width="${n(width)}" stroke-linejoin="miter" stroke-linecap="${cap}"/>`;
}

/** A metal line: solid in bright field, two bright edges in dark field. */
function metalLine(c: Ctx, points: readonly Position[], width: number, colour: string = PALETTE.bright_field.metal): string {
  if (c.look === "bright_field") return polyline(points, width, colour);
  const d = PALETTE.dark_field;
  return polyline(points, width + c.edge, d.edge) + polyline(points, Math.max(width - c.edge, c.edge / 2), d.die);
}

function box(x: number, y: number, w: number, h: number, fill: string, stroke = "none", sw = 0): string {
  return `<rect x="${n(x)}" y="${n(y)}" width="${n(w)}" height="${n(h)}" fill="${fill}" stroke="${stroke}" stroke-width="${n(sw)}"/>`;
}

/** A filled area in bright field, an outline in dark field. */
function area(c: Ctx, x: number, y: number, w: number, h: number, fill: string): string {
  const d = PALETTE.dark_field;
  return c.look === "bright_field" ? box(x, y, w, h, fill) : box(x, y, w, h, d.die, d.edge, c.edge);
}

function drawBody(c: Ctx, layout: DieLayout): string {
  const [w, h] = layout.dieSizeUm;
  const { insetUm, widthUm } = layout.sealRing;
  const ring = insetUm + widthUm / 2;
  const body =
    c.look === "bright_field" ? box(0, 0, w, h, PALETTE.bright_field.substrate) : box(0, 0, w, h, PALETTE.dark_field.die, PALETTE.dark_field.edge, c.edge);
  return (
    body +
    metalLine(
      c,
      [
        [ring, ring],
        [w - ring, ring],
        [w - ring, h - ring],
        [ring, h - ring],
        [ring, ring],
      ],
      widthUm,
    )
  );
}

function drawBlocks(c: Ctx, layout: DieLayout): string {
  const b = PALETTE.bright_field;
  const d = PALETTE.dark_field;
  return layout.blocks
    .map((block) => {
      const ring = pts(block.polygonUm);
      const fill = c.look === "bright_field" ? b.block : d.die;
      const stroke = c.look === "bright_field" ? b.metal : d.edge;
      return (
        `<g><title>${esc(block.name)}</title><polygon points="${ring}" fill="${fill}"/>` +
        deviceRows(c, block.polygonUm) +
        `<polygon points="${ring}" fill="none" stroke="${stroke}" stroke-width="${n(c.look === "bright_field" ? 4 : c.edge)}"/></g>`
      );
    })
    .join("");
}

function drawCapacitors(c: Ctx, layout: DieLayout): string {
  const b = PALETTE.bright_field;
  return layout.capacitors
    .map(({ name, centreUm: [x, y], sizeUm: [w, h] }) => {
      const inset = 8;
      return (
        `<g><title>${esc(name)}</title>${area(c, x - w / 2, y - h / 2, w, h, b.metal)}` +
        `${area(c, x - w / 2 + inset, y - h / 2 + inset, w - 2 * inset, h - 2 * inset, b.capPlate)}</g>`
      );
    })
    .join("");
}

function drawTraces(c: Ctx, traces: readonly Trace[]): string {
  return traces.map((t) => metalLine(c, t.pointsUm, t.widthUm)).join("");
}

function drawSpirals(c: Ctx, layout: DieLayout): string {
  return layout.spirals
    .map((s) => {
      const { top, under } = spiralPaths(s);
      const lower = under.map((p) => metalLine(c, p, s.widthUm * 0.6, PALETTE.bright_field.underMetal)).join("");
      return `<g><title>${esc(s.name)}</title>${lower}${top.map((p) => metalLine(c, p, s.widthUm)).join("")}</g>`;
    })
    .join("");
}

/** A pad: metal, its passivation opening, and the scrub mark a probe needle leaves. */
function drawPad(c: Ctx, layout: DieLayout, pad: Pad): string {
  const b = PALETTE.bright_field;
  const [x, y] = pad.centreUm;
  const [w, h] = pad.sizeUm;
  const i = layout.padOpeningInsetUm;
  let body = area(c, x - w / 2, y - h / 2, w, h, b.metal) + area(c, x - w / 2 + i, y - h / 2 + i, w - 2 * i, h - 2 * i, b.padOpening);
  if (pad.state === "probed") {
    // Scrub off-centre toward the die interior, where the needle slid after touchdown.
    const [dx, dy] = { left: [16, 0], right: [-16, 0], top: [0, -16], bottom: [0, 16] }[pad.side];
    const fill = c.look === "bright_field" ? b.scrub : "none";
    const stroke = c.look === "bright_field" ? "none" : PALETTE.dark_field.faint;
    body += `<ellipse cx="${n(x + dx)}" cy="${n(y + dy)}" rx="${dx ? 9 : 5}" ry="${dy ? 9 : 5}" fill="${fill}" stroke="${stroke}" stroke-width="${n(c.edge / 2)}"/>`;
  }
  return `<g id="pad-${esc(pad.label)}" data-net="${esc(pad.net)}" data-state="${pad.state}"><title>${esc(pad.label)}</title>${body}</g>`;
}

/** A gold wire with its ball on the pad and its stitch on the package side. */
function drawBond(c: Ctx, bond: WireBond): string {
  const b = PALETTE.bright_field;
  const d = PALETTE.dark_field;
  const path: Position[] = [bond.fromUm, bond.toUm];
  const r = bond.diameterUm * 1.2;
  const [ex, ey] = bond.toUm;
  if (c.look === "bright_field") {
    return (
      polyline(path, bond.diameterUm, b.goldEdge) +
      polyline(path, bond.diameterUm * 0.55, b.gold) +
      `<circle cx="${n(bond.fromUm[0])}" cy="${n(bond.fromUm[1])}" r="${n(r)}" fill="${b.gold}" stroke="${b.goldEdge}" stroke-width="4"/>` +
      `<circle cx="${n(ex)}" cy="${n(ey)}" r="${n(bond.diameterUm)}" fill="${b.gold}" stroke="${b.goldEdge}" stroke-width="4"/>`
    );
  }
  return (
    polyline(path, bond.diameterUm + c.edge, d.edge) +
    polyline(path, bond.diameterUm - c.edge, d.background) +
    `<circle cx="${n(bond.fromUm[0])}" cy="${n(bond.fromUm[1])}" r="${n(r)}" fill="${d.background}" stroke="${d.edge}" stroke-width="${n(c.edge)}"/>` +
    `<circle cx="${n(ex)}" cy="${n(ey)}" r="${n(bond.diameterUm)}" fill="${d.background}" stroke="${d.edge}" stroke-width="${n(c.edge)}"/>`
  );
}

function drawText(c: Ctx, layout: DieLayout): string {
  const paint =
    c.look === "bright_field" ? `fill="${PALETTE.bright_field.metal}"` : `fill="none" stroke="${PALETTE.dark_field.edge}" stroke-width="${n(c.edge / 2)}"`;
  return layout.textMarks
    .map(({ text, positionUm: [x, y], heightUm }) => {
      // The die group flips y; flip the glyphs back so the text reads upright. Cap height of
      // a sans face is about 0.72 em, so the font size is the mark's height / 0.72.
      const size = heightUm / 0.72;
      return `<text transform="translate(${n(x)},${n(y)}) scale(1,-1)" font-family="DejaVu Sans, Liberation Sans, sans-serif" font-weight="bold" font-size="${n(size)}" ${paint}>${esc(text)}</text>`;
    })
    .join("");
}

/**
 * Rows of devices inside a block: stripes 6 µm tall every 16 µm, drawn as plain rectangles
 * (an SVG pattern under a rotated transform is very slow in librsvg). Stripes sit at
 * y = 16k + 5 … 16k + 11, which is symmetric about y = 800 (= 16·50).
 */
function deviceRows(c: Ctx, ring: readonly Position[]): string {
  const xs = ring.map((p) => p[0]);
  const ys = ring.map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs) + 4, Math.max(...xs) - 4, Math.min(...ys), Math.max(...ys)];
  const colour = c.look === "bright_field" ? PALETTE.bright_field.metal : PALETTE.dark_field.faint;
  const paint = c.look === "bright_field" ? `fill="${colour}" fill-opacity="0.28"` : `fill="none" stroke="${colour}" stroke-width="${n(c.edge / 2)}"`;
  const rows: string[] = [];
  for (let k = Math.ceil((y0 + 4 - 5) / 16); 16 * k + 11 <= y1 - 4; k += 1) {
    rows.push(`<rect x="${n(x0)}" y="${16 * k + 5}" width="${n(x1 - x0)}" height="6" ${paint}/>`);
  }
  return rows.join("");
}

/**
 * The SVG of one micrograph of `layout`: canvas size, die position, rotation and scale come
 * from `placeDie` with the same options. SVG user units are image pixels.
 */
export function renderDieSvg(layout: DieLayout, options: RenderSvgOptions): string {
  const placement = placeDie(layout, options);
  const [[a, b, tx], [c2, d, ty]] = placement.dieToImage;
  const pxPerUmNow = Math.sqrt(Math.abs(a * d - b * c2));
  // Dark-field edges: 2 µm, but never thinner than 1.3 px so small renders still show them.
  const ctx: Ctx = { look: options.look, edge: Math.max(2, 1.3 / pxPerUmNow) };
  const { widthPx, heightPx } = placement;
  const background = options.look === "bright_field" ? PALETTE.bright_field.background : PALETTE.dark_field.background;
  const die = [
    drawBody(ctx, layout),
    drawBlocks(ctx, layout),
    drawCapacitors(ctx, layout),
    drawTraces(ctx, layout.routes),
    drawTraces(ctx, layout.meanders),
    drawSpirals(ctx, layout),
    ...layout.pads.map((p) => drawPad(ctx, layout, p)),
    drawText(ctx, layout),
    ...layout.wireBonds.map((w) => drawBond(ctx, w)),
  ].join("");
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${heightPx}" viewBox="0 0 ${widthPx} ${heightPx}">` +
    `<title>${esc(`${layout.part} (${layout.maker}), ${options.look.replace("_", " ")}`)}</title>` +
    `<rect x="0" y="0" width="${widthPx}" height="${heightPx}" fill="${background}"/>` +
    // SVG matrix(a, b, c, d, e, f) maps (x, y) to (a·x + c·y + e, b·x + d·y + f).
    // Full precision: the matrix is the ground truth, and 0.001 of 4 px/µm is 1 px across the die.
    `<g transform="matrix(${[a, c2, b, d, tx, ty].map(String).join(",")})">${die}</g></svg>`
  );
}
