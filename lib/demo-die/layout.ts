import type { Position } from "../geometry/types";
import { meanderLine, rect } from "./layout-geometry";
import type { PadState, DieSide, Pad, WireBond, Block, Spiral, Trace, Capacitor, TextMark, DieLayout } from "./layout-types";

/**
 * The invented NV-24R die of the demo scenario: a fictional 24 GHz radar receiver front end
 * (SiGe BiCMOS) by the invented maker "Nordvik Semiconductor". Everything is in die µm
 * (origin at the die's lower-left corner, x right, y up). The renderer draws exactly this, so
 * it is the ground truth for tests of pad finding, symmetry, alignment and estimates.
 *
 * The design is differential: the die's geometry (pads, blocks, spiral, lines, capacitors)
 * is mirror-symmetric about the horizontal axis y = 800 µm; the top half is written out once
 * and the bottom half derived. Deliberately not symmetric: the text marks, and the pad
 * states with the wire bonds that follow them (VB1S and VB2S are only probed, NC1 is open).
 */

const DIE_W = 2400;
const DIE_H = 1600;
const AXIS = 800;
const PAD: Position = [80, 80];
/** Pad centres sit 70 µm in from the die edge. */
const PAD_IN = 70;
/** Wires end 220 µm beyond the die edge, where the package's bond fingers would be. */
const BOND_REACH = 220;

/** Mirrors a die position across the symmetry axis y = 800 µm. */
function mirrorAcrossAxis([x, y]: Position): Position {
  return [x, 2 * AXIS - y];
}

type PadSpec = readonly [label: string, net: string, state: PadState, along: number];

function edgePads(side: DieSide, specs: readonly PadSpec[]): Pad[] {
  return specs.map(([label, net, state, along]) => {
    const centreUm: Position =
      side === "left" ? [PAD_IN, along] : side === "right" ? [DIE_W - PAD_IN, along] : side === "top" ? [along, DIE_H - PAD_IN] : [along, PAD_IN];
    return { label, net, state, side, centreUm, sizeUm: PAD };
  });
}

// Differential RF ports as ground–signal–ground–signal–ground rows (two GSG sets sharing the
// middle ground), symmetric about the axis.
const LEFT = edgePads("left", [
  ["G1", "GND", "bonded", 1100],
  ["RFIN_P", "RFIN_P", "bonded", 950],
  ["G2", "GND", "bonded", 800],
  ["RFIN_N", "RFIN_N", "bonded", 650],
  ["G3", "GND", "bonded", 500],
]);
const RIGHT = edgePads("right", [
  ["G4", "GND", "bonded", 1100],
  ["IFOUT_P", "IFOUT_P", "bonded", 950],
  ["G5", "GND", "probed", 800],
  ["IFOUT_N", "IFOUT_N", "bonded", 650],
  ["G6", "GND", "bonded", 500],
]);
// Top and bottom rows share x positions, so each top pad has its mirror partner below.
const TOP = edgePads("top", [
  ["VCC1", "VCC", "bonded", 350],
  ["VB1", "VB1", "bonded", 650],
  ["VB2", "VB2", "bonded", 950],
  ["LO_P", "LO_P", "bonded", 1250],
  ["VB3", "VB3", "bonded", 1650],
  ["VCC2", "VCC", "bonded", 2000],
]);
const BOTTOM = edgePads("bottom", [
  ["VEE1", "VEE", "bonded", 350],
  ["VB1S", "VB1_SENSE", "probed", 650],
  ["VB2S", "VB2_SENSE", "probed", 950],
  ["LO_N", "LO_N", "bonded", 1250],
  ["NC1", "NC", "unbonded", 1650],
  ["VEE2", "VEE", "bonded", 2000],
]);

const PADS: readonly Pad[] = [...LEFT, ...BOTTOM, ...RIGHT, ...TOP];

function bondFor(pad: Pad): WireBond {
  const [x, y] = pad.centreUm;
  const toUm: Position =
    pad.side === "left" ? [-BOND_REACH, y] : pad.side === "right" ? [DIE_W + BOND_REACH, y] : pad.side === "top" ? [x, DIE_H + BOND_REACH] : [x, -BOND_REACH];
  return { pad: pad.label, fromUm: pad.centreUm, toUm, diameterUm: 25 };
}

/** A block and its mirror image below the axis (ring orientation kept counter-clockwise). */
function mirroredBlocks(top: Block, bottomName: string): Block[] {
  const ring = top.polygonUm.map(mirrorAcrossAxis).reverse();
  return [top, { name: bottomName, function: top.function, polygonUm: ring }];
}

const BLOCKS: readonly Block[] = [
  { name: "LNA", function: "Low-noise amplifier, differential cascode", polygonUm: rect(190, 420, 800, 1180) },
  { name: "Mixer", function: "Double-balanced down-conversion mixer", polygonUm: rect(900, 460, 1450, 1140) },
  { name: "IF buffer", function: "IF output buffer, emitter followers", polygonUm: rect(1720, 500, 2180, 1100) },
  ...mirroredBlocks({ name: "LNA core P", function: "Input transistor pair, positive half", polygonUm: rect(520, 860, 760, 1100) }, "LNA core N"),
  ...mirroredBlocks({ name: "LO buffer P", function: "LO buffer, positive half", polygonUm: rect(1100, 1230, 1400, 1420) }, "LO buffer N"),
  ...mirroredBlocks({ name: "Bias A", function: "Bias generator for VB1 and VB2", polygonUm: rect(520, 1250, 1020, 1430) }, "Bias B"),
];

const SPIRALS: readonly Spiral[] = [{ name: "L1", centreUm: [360, AXIS], turns: 3, outerDiameterUm: 200, widthUm: 12, spacingUm: 6 }];

const MEANDER_P: Trace = { name: "Peaking line P", pointsUm: meanderLine(1490, 1690, 970, 900, 1040, 25), widthUm: 6 };
const MEANDERS: readonly Trace[] = [MEANDER_P, { name: "Peaking line N", pointsUm: MEANDER_P.pointsUm.map(mirrorAcrossAxis), widthUm: 6 }];

/** The top-half routes; each gets a mirrored partner whose name ends in " (lower)". */
const TOP_ROUTES: readonly Trace[] = [
  {
    name: "RF input P",
    pointsUm: [
      [PAD_IN, 950],
      [520, 950],
    ],
    widthUm: 14,
  },
  {
    name: "Ground strap G1",
    pointsUm: [
      [PAD_IN, 1100],
      [190, 1100],
    ],
    widthUm: 30,
  },
  {
    name: "LNA to mixer P",
    pointsUm: [
      [800, 950],
      [900, 950],
    ],
    widthUm: 10,
  },
  {
    name: "LO feed P",
    pointsUm: [
      [1250, DIE_H - PAD_IN],
      [1250, 1420],
    ],
    widthUm: 12,
  },
  {
    name: "LO buffer to mixer P",
    pointsUm: [
      [1250, 1230],
      [1250, 1140],
    ],
    widthUm: 10,
  },
  {
    name: "Supply VCC1",
    pointsUm: [
      [350, DIE_H - PAD_IN],
      [350, 1180],
    ],
    widthUm: 30,
  },
  {
    name: "Bias VB1",
    pointsUm: [
      [650, DIE_H - PAD_IN],
      [650, 1430],
    ],
    widthUm: 10,
  },
  {
    name: "Bias VB2",
    pointsUm: [
      [950, DIE_H - PAD_IN],
      [950, 1430],
    ],
    widthUm: 10,
  },
  {
    name: "Bias VB3",
    pointsUm: [
      [1650, DIE_H - PAD_IN],
      [1650, 1160],
      [1760, 1160],
      [1760, 1100],
    ],
    widthUm: 10,
  },
  {
    name: "Supply VCC2",
    pointsUm: [
      [2000, DIE_H - PAD_IN],
      [2000, 1100],
    ],
    widthUm: 30,
  },
  {
    name: "IF output P",
    pointsUm: [
      [2180, 950],
      [DIE_W - PAD_IN, 950],
    ],
    widthUm: 14,
  },
  {
    name: "Ground strap G4",
    pointsUm: [
      [2180, 1100],
      [DIE_W - PAD_IN, 1100],
    ],
    widthUm: 30,
  },
];
const AXIS_ROUTES: readonly Trace[] = [
  {
    name: "Ground strap G2",
    pointsUm: [
      [PAD_IN, AXIS],
      [190, AXIS],
    ],
    widthUm: 30,
  },
  {
    name: "Ground strap G5",
    pointsUm: [
      [2180, AXIS],
      [DIE_W - PAD_IN, AXIS],
    ],
    widthUm: 30,
  },
];
const ROUTES: readonly Trace[] = [
  ...TOP_ROUTES,
  ...TOP_ROUTES.map((t) => ({ name: `${t.name} (lower)`, pointsUm: t.pointsUm.map(mirrorAcrossAxis), widthUm: t.widthUm })),
  ...AXIS_ROUTES,
];

const TOP_CAPS: readonly Capacitor[] = [
  { name: "C1", function: "VCC decoupling, LNA", centreUm: [260, 1330], sizeUm: [120, 140] },
  { name: "C3", function: "VCC decoupling, IF buffer", centreUm: [1880, 1330], sizeUm: [160, 160] },
  { name: "C5", function: "VB3 decoupling", centreUm: [1500, 1330], sizeUm: [120, 120] },
];
const CAPACITORS: readonly Capacitor[] = [
  ...TOP_CAPS,
  ...TOP_CAPS.map((c, i) => ({
    name: `C${2 * i + 2}`,
    function: c.function.replace("VCC", "VEE").replace("VB3", "VB3 return"),
    centreUm: mirrorAcrossAxis(c.centreUm),
    sizeUm: c.sizeUm,
  })),
];

// Text marks are the one deliberate asymmetry, as on real dies.
const TEXT_MARKS: readonly TextMark[] = [
  { kind: "maker", text: "NORDVIK", positionUm: [2120, 370], heightUm: 26 },
  { kind: "part", text: "NV-24R", positionUm: [2120, 325], heightUm: 26 },
  { kind: "mask_id", text: "NVK-M4417B", positionUm: [2115, 1400], heightUm: 18 },
  { kind: "date_code", text: "2318", positionUm: [2115, 1365], heightUm: 18 },
];

/** The whole NV-24R layout, frozen: the ground truth the demo micrographs are drawn from. */
export const NV24R_LAYOUT: DieLayout = Object.freeze({
  part: "NV-24R",
  maker: "Nordvik Semiconductor",
  process: "SiGe BiCMOS",
  description: "24 GHz radar receiver front end: LNA, mixer, IF buffer (differential)",
  dieSizeUm: [DIE_W, DIE_H] as Position,
  symmetryAxisYUm: AXIS,
  sealRing: { insetUm: 8, widthUm: 10 },
  padOpeningInsetUm: 6,
  pads: PADS,
  wireBonds: PADS.filter((p) => p.state === "bonded").map(bondFor),
  blocks: BLOCKS,
  spirals: SPIRALS,
  meanders: MEANDERS,
  routes: ROUTES,
  capacitors: CAPACITORS,
  textMarks: TEXT_MARKS,
});

/** Looks a pad up by its label; throws for an unknown label (a typo in a test or seed). */
export function padByLabel(layout: DieLayout, label: string): Pad {
  const pad = layout.pads.find((p) => p.label === label);
  if (!pad) throw new Error(`no pad labelled ${label}`);
  return pad;
}
