"use client";

import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import type { z } from "zod";
import { caseInputSchema } from "@/lib/validation/cases";
import { Button } from "@/components/ui/button";
import { FormMessage, TextArea, TextField } from "@/components/ui/field";

type Values = z.input<typeof caseInputSchema>;
type Output = z.output<typeof caseInputSchema>;

/** Create or edit a case; the same zod schema validates here and on the server. */
export function CaseForm({
  initial,
  submitLabel,
  onSubmit,
  onCancel,
  children,
}: {
  initial?: Partial<Output>;
  submitLabel: string;
  onSubmit: (values: Output) => Promise<void>;
  onCancel: () => void;
  children?: React.ReactNode;
}) {
  const [serverError, setServerError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values, unknown, Output>({
    resolver: zodResolver(caseInputSchema),
    // Only the form's own fields: the strict schema refuses anything else (ids, timestamps).
    defaultValues: {
      title: initial?.title ?? "",
      partMarking: initial?.partMarking ?? "",
      package: initial?.package ?? "",
      sampleId: initial?.sampleId ?? "",
      notes: initial?.notes ?? "",
    },
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
      {children}
      <TextField id="case-title" label="Title" error={e.title?.message} {...register("title")} />
      <div className="grid grid-cols-2 gap-3">
        <TextField id="case-marking" label="Part marking" error={e.partMarking?.message} {...register("partMarking")} />
        <TextField id="case-package" label="Package" error={e.package?.message} {...register("package")} />
      </div>
      <TextField id="case-sample" label="Sample id" error={e.sampleId?.message} {...register("sampleId")} />
      <TextArea id="case-notes" label="Notes" error={e.notes?.message} {...register("notes")} />
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
