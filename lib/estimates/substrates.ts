/**
 * Usual relative permittivities of die and package substrates, for filling the er field.
 * Values are common practice (handbook-typical, low-frequency, room temperature), not a
 * measurement of any one wafer; anisotropic crystals list the range across orientations.
 */
export type SubstratePreset = {
  readonly id: string;
  readonly name: string;
  /** The value to use by default. */
  readonly er: number;
  /** Spread of values seen in practice (orientation, doping, grade). */
  readonly erRange: readonly [number, number];
  readonly note: string;
  readonly basis: "common practice";
};

export const SUBSTRATE_PRESETS: readonly SubstratePreset[] = [
  { id: "si", name: "Silicon", er: 11.9, erRange: [11.7, 11.9], note: "high-resistivity Si; lossy when doped", basis: "common practice" },
  {
    id: "sige-on-si",
    name: "SiGe on Si",
    er: 11.9,
    erRange: [11.7, 11.9],
    note: "SiGe BiCMOS: the thin SiGe layer sits on a Si substrate, so Si governs",
    basis: "common practice",
  },
  { id: "gaas", name: "Gallium arsenide", er: 12.9, erRange: [12.9, 13.1], note: "semi-insulating GaAs", basis: "common practice" },
  { id: "inp", name: "Indium phosphide", er: 12.4, erRange: [12.4, 12.6], note: "semi-insulating InP", basis: "common practice" },
  { id: "sic", name: "Silicon carbide", er: 9.7, erRange: [9.7, 10.0], note: "4H/6H-SiC; mildly anisotropic", basis: "common practice" },
  { id: "sapphire", name: "Sapphire", er: 9.4, erRange: [9.4, 11.6], note: "9.4 perpendicular, 11.6 parallel to the c-axis", basis: "common practice" },
  { id: "alumina", name: "Alumina (96–99.6 %)", er: 9.8, erRange: [9.4, 9.9], note: "thin-film and thick-film ceramic", basis: "common practice" },
  { id: "aln", name: "Aluminium nitride", er: 8.8, erRange: [8.6, 8.9], note: "ceramic substrate for power parts", basis: "common practice" },
  {
    id: "fused-silica",
    name: "Fused silica",
    er: 3.8,
    erRange: [3.78, 3.82],
    note: "quartz glass; also close to SiO₂ dielectric layers",
    basis: "common practice",
  },
];

/** The preset with this id, or undefined. */
export function substratePreset(id: string): SubstratePreset | undefined {
  return SUBSTRATE_PRESETS.find((p) => p.id === id);
}
