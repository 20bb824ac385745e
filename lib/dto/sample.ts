// The sample record of a case and its chain of custody, as the API answers them.
import type { CustodyAction, PreparationMethod } from "./stored-values";

/** One preparation step, in the order the lab did them. Dates are ISO 8601 (UTC). */
export type PreparationStep = {
  method: PreparationMethod;
  chemicals: string;
  equipment: string;
  performedBy: string;
  performedAt: string | null;
  notes: string;
};

/**
 * What the lab knows of the physical sample. A case with no record yet answers the empty
 * record: `receivedAt` null, the texts "", `preparation` [].
 */
export type SampleRecordDto = {
  receivedAt: string | null;
  receivedFrom: string;
  condition: string;
  storageLocation: string;
  preparation: PreparationStep[];
};

/** One entry of the append-only chain of custody; who and when are the server's. */
export type CustodyEventDto = {
  id: string;
  action: CustodyAction;
  to: string;
  location: string;
  note: string;
  actorId: string | null;
  actorName: string;
  at: string;
};
