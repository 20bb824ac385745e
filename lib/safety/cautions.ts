/**
 * Cautions shown beside sample preparation and pad probing, and printed in the report. They
 * name the usual hazards only: Kerfline gives no procedure, and every caution ends by
 * deferring to the lab's own rules. Wording is ours, in plain English.
 */
import type { PreparationMethod } from "@/lib/dto/stored-values";

export const HAZARDS = ["acid", "laser", "plasma", "iii_v_dust", "probing", "general"] as const;
export type Hazard = (typeof HAZARDS)[number];

export type Caution = { readonly hazard: Hazard; readonly title: string; readonly text: string };

/** The sentence every caution ends with. */
export const DEFER_TO_LAB = "Follow your lab's own safety rules, its chemical hygiene plan and local regulations; this record gives no procedure.";

const caution = (hazard: Hazard, title: string, body: string): Caution => ({ hazard, title, text: `${body} ${DEFER_TO_LAB}` });

export const CAUTIONS: Readonly<Record<Hazard, Caution>> = {
  acid: caution(
    "acid",
    "Acid decapsulation and wet etching",
    "Fuming nitric and sulfuric acids are strongly corrosive and oxidising, and they are used hot. " +
      "Such work belongs in a fume hood, with acid-resistant gloves, a face shield and eye protection, by people trained for it. " +
      "Spent acid and rinse water are hazardous waste.",
  ),
  laser: caution(
    "laser",
    "Laser decapsulation",
    "Laser decapsulation systems use lasers of a high class that can injure eyes and skin and start fires. " +
      "Keep the enclosure and its interlocks intact, wear the eye protection rated for the laser, and run fume extraction: the burnt moulding compound gives off harmful fumes.",
  ),
  plasma: caution(
    "plasma",
    "Plasma and reactive-ion etching",
    "Plasma and reactive-ion etchers use toxic, corrosive or asphyxiant process gases and make hazardous by-products, and they work with high voltage and RF power. " +
      "Only people trained on the tool should run it, with its gas detection, exhaust and interlocks in service.",
  ),
  iii_v_dust: caution(
    "iii_v_dust",
    "Polishing or cutting III-V dies (GaAs, InP)",
    "This applies to III-V dies such as gallium arsenide (GaAs) or indium phosphide (InP): grinding, polishing or cutting them makes toxic dust and slurry containing arsenic or indium compounds. " +
      "Keep the work wet, use local extraction, do not eat or drink nearby, and treat slurry, swarf and wipes as hazardous waste.",
  ),
  probing: caution(
    "probing",
    "Powered or high-voltage probing",
    "Probing a powered die can expose people to electric shock where supply or test voltages are high, and can destroy the part by electrostatic discharge. " +
      "Use grounded ESD protection, make and break contacts with power off where the set-up allows, and respect the station's voltage and current limits.",
  ),
  general: caution(
    "general",
    "Sample preparation",
    "Opening or preparing a package can involve sharp tools, heat, chemicals and fragile parts that may shatter. " +
      "Wear the protection the task calls for and use only tools you are trained on.",
  ),
};

/** Which caution applies to each preparation method. */
const METHOD_HAZARD: Readonly<Record<PreparationMethod, Hazard>> = {
  acid_decap: "acid",
  delayer_wet: "acid",
  laser_decap: "laser",
  plasma_etch: "plasma",
  delayer_rie: "plasma",
  mechanical_polish: "iii_v_dust",
  cross_section: "iii_v_dust",
  delid: "general",
  other: "general",
};

/** The caution to show beside a step with this method. */
export function cautionFor(method: PreparationMethod): Caution {
  return CAUTIONS[METHOD_HAZARD[method]];
}

/** The cautions for a set of methods, each once, in the order of first use (the report's list). */
export function cautionsForMethods(methods: readonly PreparationMethod[]): Caution[] {
  const seen = new Set<Hazard>();
  return methods.map(cautionFor).filter((c) => !seen.has(c.hazard) && seen.add(c.hazard));
}

/** The caution pads marked "probed" point to. */
export const PROBING_CAUTION = CAUTIONS.probing;
