"use client";

import { useFieldArray, useWatch, type Control, type FieldErrors, type UseFormRegister } from "react-hook-form";
import { PREPARATION_METHODS } from "@/lib/dto/stored-values";
import { cautionFor } from "@/lib/safety/cautions";
import { METHOD_LABELS } from "@/lib/sample/labels";
import type { SampleRecordInput } from "@/lib/validation/sample";
import { Button } from "@/components/ui/button";
import { CautionNote } from "@/components/ui/caution-note";
import { TextArea, TextField } from "@/components/ui/field";
import { InstantField } from "./instant-field";

type Props = { control: Control<SampleRecordInput>; register: UseFormRegister<SampleRecordInput>; errors: FieldErrors<SampleRecordInput>; editable: boolean };

const NEW_STEP = { method: "other", chemicals: "", equipment: "", performedBy: "", performedAt: null, notes: "" } as const;

/** The preparation steps in the lab's order, each with the caution for its method beside it. */
export function PreparationSteps({ control, register, errors, editable }: Props) {
  const { fields, append, remove } = useFieldArray({ control, name: "preparation" });
  const methods = useWatch({ control, name: "preparation" });
  return (
    <div className="flex flex-col gap-3">
      <h3 className="text-sm font-semibold text-ink-100">Preparation</h3>
      {fields.length === 0 && <p className="text-sm text-ink-400">No preparation steps recorded.</p>}
      <ol className="flex flex-col gap-3">
        {fields.map((f, i) => {
          const e = errors.preparation?.[i];
          const id = (k: string) => `prep-${i}-${k}`;
          const method = methods?.[i]?.method ?? f.method;
          return (
            <li key={f.id} className="grid gap-3 rounded-md border border-ink-800 bg-ink-950/40 p-3 lg:grid-cols-[1fr_20rem]">
              <fieldset className="flex flex-col gap-2">
                <legend className="pb-1 text-xs font-semibold uppercase tracking-wide text-ink-400">Step {i + 1}</legend>
                <div className="flex flex-col gap-1">
                  <label htmlFor={id("method")} className="text-xs font-medium text-ink-300">
                    Method
                  </label>
                  <select
                    id={id("method")}
                    {...register(`preparation.${i}.method`)}
                    className="w-full rounded-md border border-ink-700 bg-ink-900 px-2.5 py-1.5 text-sm text-ink-100 focus:border-kerf-500 focus:outline-none"
                  >
                    {PREPARATION_METHODS.map((m) => (
                      <option key={m} value={m}>
                        {METHOD_LABELS[m]}
                      </option>
                    ))}
                  </select>
                </div>
                <div className="grid gap-2 md:grid-cols-2">
                  <TextField id={id("chemicals")} label="Chemicals" error={e?.chemicals?.message} {...register(`preparation.${i}.chemicals`)} />
                  <TextField id={id("equipment")} label="Equipment" error={e?.equipment?.message} {...register(`preparation.${i}.equipment`)} />
                  <TextField id={id("by")} label="Performed by" error={e?.performedBy?.message} {...register(`preparation.${i}.performedBy`)} />
                  <InstantField control={control} name={`preparation.${i}.performedAt`} id={id("at")} label="Performed at" error={e?.performedAt?.message} />
                </div>
                <TextArea id={id("notes")} label="Notes" error={e?.notes?.message} {...register(`preparation.${i}.notes`)} />
                {editable && (
                  <div className="flex justify-end">
                    <Button variant="ghost" onClick={() => remove(i)} aria-label={`Remove step ${i + 1}`}>
                      Remove step
                    </Button>
                  </div>
                )}
              </fieldset>
              <CautionNote caution={cautionFor(method)} className="self-start" />
            </li>
          );
        })}
      </ol>
      {editable && (
        <div>
          <Button onClick={() => append({ ...NEW_STEP })}>Add step</Button>
        </div>
      )}
    </div>
  );
}
