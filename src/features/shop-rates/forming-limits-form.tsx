import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { formingLimitsUpdateSchema } from "../../../shared/schemas/shop-rates";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import type { MaterialRecord } from "../../api/materials";
import { EditRows } from "../../components/ui/edit-rows";
import { plainScale } from "../../components/ui/unit-input";
import { MaterialSelect, NumberInput, SaveBar, showServerFields, type SaveMessage } from "./form-bits";

type In = z.input<typeof formingLimitsUpdateSchema>;
type Out = z.output<typeof formingLimitsUpdateSchema>;

export function FormingLimitsForm({ current, materials }: { current: ShopRates; materials: MaterialRecord[] }) {
  const save = useSaveShopRates();
  const [asking, setAsking] = useState<Out | null>(null);
  const [message, setMessage] = useState<SaveMessage>(null);
  const { register, handleSubmit, control, setError, reset, formState: { errors } } = useForm<In, unknown, Out>({ resolver: zodResolver(formingLimitsUpdateSchema), defaultValues: { formingLimits: current.formingLimits } });
  const limits = useFieldArray({ control, name: "formingLimits" });
  const ask = handleSubmit(
    (values) => {
      setMessage(null);
      setAsking(values);
    },
    () => setMessage({ tone: "danger", text: "Some values need attention; see the messages beside them." }),
  );
  const confirm = async () => {
    if (!asking) return;
    try {
      const saved = await save.mutateAsync({ part: "forming-limits", body: asking });
      reset({ formingLimits: saved.formingLimits });
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}.` });
    } catch (error) {
      setMessage({ tone: "danger", text: showServerFields(error, setError) ?? "Some values were not accepted; see the messages beside them." });
    } finally {
      setAsking(null);
    }
  };
  return (
    <form onSubmit={ask} noValidate className="space-y-4" aria-label="Forming limits">
      <p className="text-meta text-flux-600">Limiting draw ratios on mean diameters: first draw D/d₁ (typically 1.8–2.0), each redraw (1.2–1.4). Work-hardening alloys get a process anneal between draws.</p>
      <EditRows
        caption="Forming limits"
        columns={[
          { key: "material", header: "Material", track: "minmax(10rem,1.6fr)" },
          { key: "first", header: "First draw ratio", track: "minmax(6rem,1fr)" },
          { key: "redraw", header: "Redraw ratio", track: "minmax(6rem,1fr)" },
          { key: "anneal", header: "Anneal between draws", track: "minmax(6rem,0.8fr)" },
        ]}
        rows={limits.fields}
        rowKey={(f) => f.id}
        renderRow={(_f, i, wide) => [
          <MaterialSelect key="m" control={control} errors={errors} name={`formingLimits.${i}.materialId`} label={`Material, row ${i + 1}`} materials={materials} hideLabel={wide} />,
          <NumberInput key="f" control={control} errors={errors} name={`formingLimits.${i}.firstDrawRatio`} label={`First draw ratio, row ${i + 1}`} scale={plainScale} hideLabel={wide} />,
          <NumberInput key="r" control={control} errors={errors} name={`formingLimits.${i}.redrawRatio`} label={`Redraw ratio, row ${i + 1}`} scale={plainScale} hideLabel={wide} />,
          <label key="a" className="flex min-h-touch items-center gap-2">
            <input type="checkbox" className="size-5" {...register(`formingLimits.${i}.processAnnealBetweenDraws`)} />
            <span className={wide ? "sr-only" : ""}>Anneal between draws, row {i + 1}</span>
          </label>,
        ]}
        onRemove={(i) => limits.remove(i)}
        removeLabel={(i) => `Remove forming limits ${i + 1}`}
        onAdd={() => limits.append({ materialId: "", firstDrawRatio: 1.9, redrawRatio: 1.3, processAnnealBetweenDraws: true })}
        addLabel="Add a material's limits"
      />
      <SaveBar what="forming limits" nextVersion={current.version + 1} asking={asking !== null} pending={save.isPending} message={message} onConfirm={() => void confirm()} onCancel={() => setAsking(null)} />
    </form>
  );
}
