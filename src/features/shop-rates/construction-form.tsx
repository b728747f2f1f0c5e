import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { CONSTRUCTION_WORDS, CONSTRUCTIONS, DEFAULT_CONSTRUCTION_SETTINGS } from "../../../shared/physics/build-model";
import { constructionUpdateSchema } from "../../../shared/schemas/shop-rates";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import { Button } from "../../components/ui/button";
import { fixedUnitScale, plainScale, quantityScale } from "../../components/ui/unit-input";
import { useElementWidth } from "../../lib/use-element-width";
import { NumberInput, SaveBar, showServerFields, type SaveMessage } from "./form-bits";

type In = z.input<typeof constructionUpdateSchema>;
type Out = z.output<typeof constructionUpdateSchema>;
const dB = fixedUnitScale("dB", "decibels");
const mm = quantityScale("length", "mm");

/** What the as-built prediction assumes of the shop's construction: the ceiling each construction levels off at, and the lid fit. */
export function ConstructionForm({ current }: { current: ShopRates }) {
  const save = useSaveShopRates();
  const [asking, setAsking] = useState<Out | null>(null);
  const [message, setMessage] = useState<SaveMessage>(null);
  const [ref, width] = useElementWidth<HTMLDivElement>();
  const wide = width === 0 || width >= 560;
  const { handleSubmit, control, setError, reset, formState: { errors } } = useForm<In, unknown, Out>({
    resolver: zodResolver(constructionUpdateSchema),
    defaultValues: { construction: current.construction },
  });
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
      const saved = await save.mutateAsync({ part: "construction", body: asking });
      reset({ construction: saved.construction });
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}. Predictions use it from now on.` });
    } catch (error) {
      setMessage({ tone: "danger", text: showServerFields(error, setError) ?? "Some values were not accepted; see the messages beside them." });
    } finally {
      setAsking(null);
    }
  };
  const grid = "grid items-start gap-3 sm:grid-cols-[minmax(0,1.4fr)_minmax(8rem,1fr)_minmax(8rem,1fr)]";
  return (
    <form onSubmit={ask} noValidate className="space-y-4" aria-label="Construction limits">
      <p className="text-meta text-flux-600">
        A built shield levels off below the seamless shell's figure: lid fit, the last seam, handling after the anneal. The design check combines each construction's ceiling with the
        ideal as 1/S = 1/S<sub>ideal</sub> + 1/S<sub>ceiling</sub>. The defaults are from practice ({DEFAULT_CONSTRUCTION_SETTINGS.ceilings["closed-can"].firstLayer_db} dB for one drawn can,{" "}
        {DEFAULT_CONSTRUCTION_SETTINGS.ceilings["closed-can"].perExtraLayer_db} dB more for each nested layer); the shop's measured lots are the better guide.
      </p>
      <div ref={ref} className="space-y-1" role="group" aria-label="Ceiling of each construction">
        {wide && (
          <div className={`${grid} border-b border-nickel-300 pb-1 text-meta font-semibold text-flux-600`} aria-hidden="true">
            <span>Construction</span>
            <span>One layer</span>
            <span>Each further layer</span>
          </div>
        )}
        {CONSTRUCTIONS.map((c) => (
          <div key={c} className={`${grid} border-b border-nickel-100 py-1`} role="group" aria-label={CONSTRUCTION_WORDS[c]}>
            <p className="pt-2.5 font-semibold text-flux-900 first-letter:uppercase">{CONSTRUCTION_WORDS[c]}</p>
            <NumberInput control={control} errors={errors} name={`construction.ceilings.${c}.firstLayer_db`} label={`One layer, ${CONSTRUCTION_WORDS[c]}`} scale={dB} hideLabel={wide} />
            <NumberInput control={control} errors={errors} name={`construction.ceilings.${c}.perExtraLayer_db`} label={`Each further layer, ${CONSTRUCTION_WORDS[c]}`} scale={dB} hideLabel={wide} />
          </div>
        ))}
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        <NumberInput control={control} errors={errors} name="construction.lidClearance_mm" label="Lid clearance per side" scale={mm} />
        <NumberInput control={control} errors={errors} name="construction.lidOverlapFraction" label="Lid overlap, share of the length" scale={plainScale} />
        <NumberInput control={control} errors={errors} name="construction.lidOverlapMin_mm" label="Shortest lid overlap" scale={mm} />
      </div>
      <SaveBar
        what="construction limits"
        nextVersion={current.version + 1}
        asking={asking !== null}
        pending={save.isPending}
        message={message}
        onConfirm={() => void confirm()}
        onCancel={() => setAsking(null)}
        extra={
          <Button variant="quiet" onClick={() => reset({ construction: DEFAULT_CONSTRUCTION_SETTINGS })}>
            Back to the defaults
          </Button>
        }
      />
    </form>
  );
}
