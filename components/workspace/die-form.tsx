"use client";

import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import type { z } from "zod";
import { dieInputSchema } from "@/lib/validation/dies";
import { Button } from "@/components/ui/button";
import { FormMessage, TextArea, TextField } from "@/components/ui/field";

type Values = z.input<typeof dieInputSchema>;
type Output = z.output<typeof dieInputSchema>;

/** An empty number input means "not known yet" (null), not zero. */
const optionalNumber = { setValueAs: (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v)) };

/** Create or edit a die; the same zod schema validates here and on the server. */
export function DieForm({
  initial,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  initial?: Partial<Output>;
  submitLabel: string;
  onSubmit: (values: Output) => Promise<void>;
  onCancel: () => void;
}) {
  const [serverError, setServerError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values, unknown, Output>({
    resolver: zodResolver(dieInputSchema),
    // Only the form's own fields: the strict schema refuses anything else (ids, timestamps).
    defaultValues: { name: initial?.name ?? "", widthUm: initial?.widthUm ?? null, heightUm: initial?.heightUm ?? null, notes: initial?.notes ?? "" },
  });
  const e = formState.errors;
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit(async (values) => {
        setServerError(null);
        try {
          await onSubmit(values);
        } catch (err) {
          setServerError((err as Error).message);
        }
      })}
    >
      <TextField id="die-name" label="Name" error={e.name?.message} {...register("name")} />
      <div className="grid grid-cols-2 gap-3">
        <TextField
          id="die-width"
          type="number"
          step="any"
          label="Width (µm)"
          hint="Leave empty if not known yet"
          error={e.widthUm?.message}
          {...register("widthUm", optionalNumber)}
        />
        <TextField id="die-height" type="number" step="any" label="Height (µm)" error={e.heightUm?.message} {...register("heightUm", optionalNumber)} />
      </div>
      <TextArea id="die-notes" label="Notes" error={e.notes?.message} {...register("notes")} />
      <FormMessage message={serverError} />
      <div className="flex justify-end gap-2">
        <Button onClick={onCancel}>Cancel</Button>
        <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Saving…" : submitLabel}
        </Button>
      </div>
    </form>
  );
}
