import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { CONSTRUCTION_WORDS, CONSTRUCTIONS, DEFAULT_CONSTRUCTION_SETTINGS } from "../../../shared/physics/build-model";
import { constructionUpdateSchema } from "../../../shared/schemas/shop-rates";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import { Button } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { StatusNote } from "../../components/ui/status-note";
import { ConfirmSave, NumberInput, showServerFields } from "./form-bits";

type In = z.input<typeof constructionUpdateSchema>;
type Out = z.output<typeof constructionUpdateSchema>;

/** What the as-built prediction assumes of the shop's construction: the ceiling each construction levels off at, and the lid fit. */
export function ConstructionForm({ current }: { current: ShopRates }) {
  const save = useSaveShopRates();
  const [message, setMessage] = useState<{ tone: "ok" | "danger"; text: string } | null>(null);
  const { register, handleSubmit, setError, reset, formState: { errors } } = useForm<In, unknown, Out>({
    resolver: zodResolver(constructionUpdateSchema),
    defaultValues: { construction: current.construction },
  });
  const submit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const saved = await save.mutateAsync({ part: "construction", body: values });
      reset({ construction: saved.construction });
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}. Predictions use it from now on.` });
    } catch (error) {
      setMessage({ tone: "danger", text: showServerFields(error, setError) ?? "Some values were not accepted; see the fields." });
    }
  });
  return (
    <Panel title="Construction limits (predictions)">
      <form onSubmit={(e) => e.preventDefault()} noValidate className="space-y-4" aria-label="Construction limits">
        {message && <StatusNote tone={message.tone} word={message.tone === "ok" ? "Saved" : "Not saved"}>{message.text}</StatusNote>}
        <p className="text-meta text-flux-600">
          A built shield levels off below the seamless shell's figure: lid fit, the last seam, handling after the anneal. The design check combines each construction's ceiling with the
          ideal as 1/S = 1/S<sub>ideal</sub> + 1/S<sub>ceiling</sub>. The defaults are from practice ({DEFAULT_CONSTRUCTION_SETTINGS.ceilings["closed-can"].firstLayer_db} dB for one drawn can,{" "}
          {DEFAULT_CONSTRUCTION_SETTINGS.ceilings["closed-can"].perExtraLayer_db} dB more for each nested layer); the shop's measured lots are the better guide.
        </p>
        <div className="space-y-3">
          {CONSTRUCTIONS.map((c) => (
            <div key={c} className="grid items-end gap-3 border-b border-nickel-100 pb-3 sm:grid-cols-[1fr_10rem_10rem]" role="group" aria-label={CONSTRUCTION_WORDS[c]}>
              <p className="pb-2 font-semibold text-flux-900 first-letter:uppercase">{CONSTRUCTION_WORDS[c]}</p>
              <NumberInput register={register} errors={errors} name={`construction.ceilings.${c}.firstLayer_db`} label="One layer (dB)" />
              <NumberInput register={register} errors={errors} name={`construction.ceilings.${c}.perExtraLayer_db`} label="Each further layer (dB)" />
            </div>
          ))}
        </div>
        <div className="grid gap-3 sm:grid-cols-3">
          <NumberInput register={register} errors={errors} name="construction.lidClearance_mm" label="Lid clearance per side (mm)" />
          <NumberInput register={register} errors={errors} name="construction.lidOverlapFraction" label="Lid overlap, share of the length" />
          <NumberInput register={register} errors={errors} name="construction.lidOverlapMin_mm" label="Shortest lid overlap (mm)" />
        </div>
        <div className="flex flex-wrap items-start gap-3">
          <ConfirmSave what="construction limits" nextVersion={current.version + 1} pending={save.isPending} onConfirm={() => void submit()} />
          <Button variant="quiet" onClick={() => reset({ construction: DEFAULT_CONSTRUCTION_SETTINGS })}>
            Back to the defaults
          </Button>
        </div>
      </form>
    </Panel>
  );
}
