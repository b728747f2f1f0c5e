import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { formingLimitsUpdateSchema } from "../../../shared/schemas/shop-rates";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { StatusNote } from "../../components/ui/status-note";
import { ConfirmSave, NumberInput, showServerFields } from "./form-bits";

type In = z.input<typeof formingLimitsUpdateSchema>;
type Out = z.output<typeof formingLimitsUpdateSchema>;

export function FormingLimitsForm({ current }: { current: ShopRates }) {
  const save = useSaveShopRates();
  const [message, setMessage] = useState<{ tone: "ok" | "danger"; text: string } | null>(null);
  const { register, handleSubmit, control, setError, reset, formState: { errors } } = useForm<In, unknown, Out>({ resolver: zodResolver(formingLimitsUpdateSchema), defaultValues: { formingLimits: current.formingLimits } });
  const limits = useFieldArray({ control, name: "formingLimits" });
  const submit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const saved = await save.mutateAsync({ part: "forming-limits", body: values });
      reset({ formingLimits: saved.formingLimits });
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}.` });
    } catch (error) {
      setMessage({ tone: "danger", text: showServerFields(error, setError) ?? "Some values were not accepted; see the fields." });
    }
  });
  return (
    <Panel title="Forming limits">
      <form onSubmit={(e) => e.preventDefault()} noValidate className="space-y-4" aria-label="Forming limits">
        {message && <StatusNote tone={message.tone} word={message.tone === "ok" ? "Saved" : "Not saved"}>{message.text}</StatusNote>}
        <p className="text-meta text-flux-600">Limiting draw ratios on mean diameters: first draw D/d₁ (typically 1.8–2.0), each redraw (1.2–1.4). Work-hardening alloys get a process anneal between draws.</p>
        {limits.fields.map((f, i) => (
          <div key={f.id} className="grid items-end gap-3 border-b border-nickel-100 pb-3 sm:grid-cols-[1fr_1fr_1fr_auto_auto]">
            <TextField label="Material id" error={errors.formingLimits?.[i]?.materialId?.message} {...register(`formingLimits.${i}.materialId`)} />
            <NumberInput register={register} errors={errors} name={`formingLimits.${i}.firstDrawRatio`} label="First draw ratio" />
            <NumberInput register={register} errors={errors} name={`formingLimits.${i}.redrawRatio`} label="Redraw ratio" />
            <label className="flex min-h-touch items-center gap-2">
              <input type="checkbox" className="size-5" {...register(`formingLimits.${i}.processAnnealBetweenDraws`)} /> Anneal between draws
            </label>
            <Button variant="quiet" onClick={() => limits.remove(i)} aria-label={`Remove limits ${i + 1}`}>Remove</Button>
          </div>
        ))}
        <Button variant="secondary" onClick={() => limits.append({ materialId: "", firstDrawRatio: 1.9, redrawRatio: 1.3, processAnnealBetweenDraws: true })}>Add a material</Button>
        <ConfirmSave what="forming limits" nextVersion={current.version + 1} pending={save.isPending} onConfirm={() => void submit()} />
      </form>
    </Panel>
  );
}
