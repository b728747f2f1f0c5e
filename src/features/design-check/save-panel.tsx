import { useEffect, useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import { useQuery } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { designNameSchema } from "../../../shared/schemas/design";
import type { PredictionRequest } from "../../../shared/schemas/prediction";
import { quantitySchema, requiredAttenuationSchema } from "../../../shared/schemas/quote";
import { designQueryOptions, useCreateDesign, useUpdateDesign } from "../../api/designs";
import { useCreateQuote } from "../../api/quotes";
import { ControlledUnitInput } from "../../components/forms/controlled-unit-input";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { StatusNote } from "../../components/ui/status-note";
import { fixedUnitScale, plainScale } from "../../components/ui/unit-input";
import { paths } from "../../config/paths";
import { useServerErrors } from "../../lib/use-server-errors";
import { configurationFromRequest } from "./saved-design";

const saveSchema = z.object({ name: designNameSchema, requiredAttenuation_db: requiredAttenuationSchema, quantity: quantitySchema });
type SaveValues = z.input<typeof saveSchema>;
const dB = fixedUnitScale("dB", "decibels");

/**
 * The configurator's part for a signed-in customer: the design on screen saved under a name with
 * the attenuation it must reach, saved again after edits, and quoted at a quantity (the quote
 * freezes the prediction, the blanks and the price). `savedId` is the saved design the page was
 * opened from (kept in the address bar).
 */
export function SavePanel({ request, savedId, onSaved, predicted_db }: { request: PredictionRequest | null; savedId: string | null; onSaved: (id: string) => void; predicted_db: number | null }) {
  const saved = useQuery({ ...designQueryOptions(savedId ?? ""), enabled: savedId !== null });
  const create = useCreateDesign();
  const update = useUpdateDesign();
  const quote = useCreateQuote();
  const navigate = useNavigate();
  const [done, setDone] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, reset, formState } = useForm<SaveValues>({
    resolver: zodResolver(saveSchema),
    defaultValues: { name: "", requiredAttenuation_db: predicted_db !== null ? Math.max(0, Math.floor(predicted_db / 5) * 5) : 40, quantity: 10 },
  });
  const { formMessage, showServerError, clearFormMessage } = useServerErrors(setError, ["name", "requiredAttenuation_db", "quantity"]);

  // opened from a saved design: its name and the attenuation it needs fill the form
  const design = saved.data;
  useEffect(() => {
    if (design) reset((v) => ({ ...v, name: design.name, requiredAttenuation_db: design.configuration.requiredAttenuation_db }));
  }, [design, reset]);

  const configuration = (need: number) => (request ? configurationFromRequest(request, need) : { ok: false as const, message: "Correct the design first: some values cannot be used." });
  const fail = (message: string) => setError("root", { message });

  const save = (asNew: boolean) =>
    handleSubmit(async (values) => {
      setDone(null);
      clearFormMessage();
      const made = configuration(values.requiredAttenuation_db);
      if (!made.ok) return fail(made.message);
      try {
        const result = !asNew && design ? await update.mutateAsync({ id: design.id, name: values.name, configuration: made.configuration }) : await create.mutateAsync({ name: values.name, configuration: made.configuration });
        onSaved(result.id);
        setDone(!asNew && design ? `Changes saved to “${result.name}”.` : `Saved as “${result.name}”.`);
      } catch (error) {
        showServerError(error);
      }
    });

  const askQuote = handleSubmit(async (values) => {
    setDone(null);
    clearFormMessage();
    const made = configuration(values.requiredAttenuation_db);
    if (!made.ok) return fail(made.message);
    try {
      const q = await quote.mutateAsync({ configuration: made.configuration, quantity: values.quantity, ...(design ? { designId: design.id } : {}) });
      navigate(paths.quote.href(q.id));
    } catch (error) {
      showServerError(error);
    }
  });

  const { errors, isSubmitting } = formState;
  const problem = errors.root?.message ?? formMessage;
  return (
    <form noValidate onSubmit={(e) => e.preventDefault()} className="space-y-4" data-testid="save-panel">
      {design ? (
        <p className="text-flux-700">
          Opened from your saved design <strong className="text-flux-950">“{design.name}”</strong>. Edits stay on this page until you save them.
        </p>
      ) : (
        <p className="text-flux-700">Save this design under a name to open, compare or quote it later.</p>
      )}
      <TextField label="Design name" autoComplete="off" error={errors.name?.message} {...register("name")} />
      <ControlledUnitInput control={control} errors={errors} name="requiredAttenuation_db" label="Attenuation needed" scale={dB} hint="The quote and the lot's measurements are checked against it." />
      {problem && (
        <StatusNote tone="danger" word="Not saved" live="assertive">
          {problem}
        </StatusNote>
      )}
      <div className="flex flex-wrap gap-2">
        {design?.abilities.update && (
          <Button onClick={() => void save(false)()} pending={isSubmitting && update.isPending} pendingLabel="Saving…" disabled={isSubmitting}>
            Save changes
          </Button>
        )}
        <Button variant={design ? "secondary" : "primary"} onClick={() => void save(true)()} pending={isSubmitting && create.isPending} pendingLabel="Saving…" disabled={isSubmitting}>
          {design ? "Save as a new design" : "Save design"}
        </Button>
      </div>
      {done && (
        <StatusNote tone="ok" word="Saved" live="polite">
          {done}{" "}
          <Link to={paths.designs.href()} className="font-semibold underline underline-offset-4">
            Your designs
          </Link>
        </StatusNote>
      )}
      <div className="space-y-3 border-t border-nickel-200 pt-4">
        <h3 className="text-h4">Quote</h3>
        <p className="text-meta text-flux-600">A quote fixes the price, the prediction and the blanks for 30 days; you can order it from there.</p>
        <div className="flex flex-wrap items-end gap-3">
          <div className="w-36">
            <ControlledUnitInput control={control} errors={errors} name="quantity" label="Quantity" scale={plainScale} />
          </div>
          <Button variant="secondary" onClick={() => void askQuote()} pending={quote.isPending} pendingLabel="Quoting…" disabled={isSubmitting}>
            Get a quote
          </Button>
        </div>
      </div>
    </form>
  );
}
