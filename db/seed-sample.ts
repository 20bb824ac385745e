import "server-only";
import { caseSamples, custodyEvents } from "./schema";
import type { Database } from "./client";
import type { PreparationStep } from "@/lib/dto/sample";

type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];

/** The demo case's sample: an invented field return, a moulded QFN opened with acid. Names are fiction. */
const SAMPLE = {
  receivedAt: new Date("2026-11-16T09:20:00Z"),
  receivedFrom: "Nordvik Semiconductor field returns desk",
  condition: "One moulded QFN-24 in a sealed antistatic bag, leads intact, no visible cracks.",
  storageLocation: "Dry cabinet DC-2, shelf 3",
  preparation: [
    {
      method: "acid_decap",
      chemicals: "Fuming nitric acid",
      equipment: "Fume hood FH-1",
      performedBy: "Demo Analyst",
      performedAt: "2026-11-18T10:00:00.000Z",
      notes: "Moulding compound opened over the die; die surface and bond wires exposed.",
    },
  ] satisfies PreparationStep[],
};

/** The chain of custody so far; the analyst is the one who handled it. */
const CUSTODY = [
  { action: "received", at: "2026-11-16T09:20:00Z", to: "Fjordlight Failure Lab", location: "Goods-in desk", note: "Courier delivery, seal intact." },
  { action: "stored", at: "2026-11-16T09:45:00Z", to: "", location: "Dry cabinet DC-2, shelf 3", note: "Logged as FFL-2026-0142." },
  { action: "checked_out", at: "2026-11-18T08:30:00Z", to: "Wet lab", location: "Fume hood FH-1", note: "For decapsulation." },
  { action: "returned", at: "2026-11-18T15:10:00Z", to: "", location: "Dry cabinet DC-2, shelf 3", note: "Decapsulated; die exposed." },
] as const;

/** Seeds the demo case's sample record and custody log inside the demo seed's transaction. */
export async function seedDemoSample(tx: Tx, caseId: string, analyst: { id: string; name: string }): Promise<void> {
  await tx.insert(caseSamples).values({ caseId, ...SAMPLE, updatedBy: analyst.id });
  await tx.insert(custodyEvents).values(CUSTODY.map((e) => ({ ...e, at: new Date(e.at), caseId, actorId: analyst.id, actorName: analyst.name })));
}
