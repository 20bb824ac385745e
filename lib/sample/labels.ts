// Plain English for the sample record's stored values: the form's selects, the tables and the report.
import type { CustodyAction, PreparationMethod } from "@/lib/dto/stored-values";

/** Plain labels for the method select, the record and the report. */
export const METHOD_LABELS: Readonly<Record<PreparationMethod, string>> = {
  acid_decap: "Acid decapsulation",
  laser_decap: "Laser decapsulation",
  plasma_etch: "Plasma etching",
  mechanical_polish: "Mechanical polishing",
  delid: "Lid removal",
  delayer_wet: "Wet delayering",
  delayer_rie: "Reactive-ion delayering",
  cross_section: "Cross-sectioning",
  other: "Other",
};

export const CUSTODY_ACTION_LABELS: Readonly<Record<CustodyAction, string>> = {
  received: "Received",
  transferred: "Transferred",
  stored: "Stored",
  checked_out: "Checked out",
  returned: "Returned",
  destroyed: "Destroyed",
};
