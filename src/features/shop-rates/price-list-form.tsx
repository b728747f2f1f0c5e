import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { priceRatesSchema } from "../../../shared/schemas/shop-rates";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { StatusNote } from "../../components/ui/status-note";
import { ConfirmSave, NumberInput, showServerFields } from "./form-bits";

type In = z.input<typeof priceRatesSchema>;
type Out = z.output<typeof priceRatesSchema>;

const operations: Array<[keyof In & string, string]> = [
  ["blankingPerPart_cents", "Blanking, per blank (cents)"],
  ["formingPerDrawStage_cents", "Forming, per draw stage (cents)"],
  ["formingPerBend_cents", "Forming, per bend (cents)"],
  ["processAnnealPerAnneal_cents", "Process anneal, each (cents)"],
  ["weldingPerMetre_cents", "Welding, per metre (cents)"],
  ["cleaningPerPart_cents", "Cleaning, per piece (cents)"],
  ["hydrogenAnnealPerLoad_cents", "Hydrogen anneal, per furnace load (cents)"],
  ["partsPerFurnaceLoad", "Pieces per furnace load"],
  ["verificationPerSampledPart_cents", "Verification, per sampled part (cents)"],
  ["packingPerPart_cents", "Packing, per piece (cents)"],
  ["setupPerJob_cents", "Setup, per job (cents)"],
  ["marginPercent", "Margin (%)"],
  ["fallbackUtilisation", "Utilisation when no sheet fits (0–1)"],
  ["leadTimeWorkingDays", "Lead time quoted (working days)"],
  ["quoteValidityDays", "Quotes hold their price (days)"],
];

export function PriceListForm({ current }: { current: ShopRates }) {
  const save = useSaveShopRates();
  const [message, setMessage] = useState<{ tone: "ok" | "danger"; text: string } | null>(null);
  const { register, handleSubmit, control, setError, reset, formState: { errors } } = useForm<In, unknown, Out>({ resolver: zodResolver(priceRatesSchema), defaultValues: current.priceList });
  const materials = useFieldArray({ control, name: "materials" });
  const breaks = useFieldArray({ control, name: "quantityBreaks" });

  const submit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const saved = await save.mutateAsync({ part: "price-list", body: values });
      reset(saved.priceList);
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}.` });
    } catch (error) {
      const text = showServerFields(error, setError);
      setMessage({ tone: "danger", text: text ?? "Some values were not accepted; see the fields." });
    }
  });

  return (
    <Panel title="Prices and operation rates">
      <form onSubmit={(e) => e.preventDefault()} noValidate className="space-y-6" aria-label="Price list">
        {message && <StatusNote tone={message.tone} word={message.tone === "ok" ? "Saved" : "Not saved"} assertive={message.tone === "danger"}>{message.text}</StatusNote>}
        <TextField label="Currency (ISO 4217)" error={errors.currency?.message} {...register("currency")} className="max-w-32 font-mono" />
        <label className="flex items-center gap-2">
          <input type="checkbox" className="size-5" {...register("scrapCredit")} /> Credit offcuts at the scrap price
        </label>
        <fieldset className="space-y-3">
          <legend className="text-h4">Material prices</legend>
          {materials.fields.map((f, i) => (
            <div key={f.id} className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_1fr_auto]">
              <TextField label="Material id" error={errors.materials?.[i]?.materialId?.message} {...register(`materials.${i}.materialId`)} />
              <NumberInput register={register} errors={errors} name={`materials.${i}.pricePerKg_cents`} label="Price per kg (cents)" step="1" />
              <NumberInput register={register} errors={errors} name={`materials.${i}.scrapCreditPerKg_cents`} label="Scrap credit per kg (cents)" step="1" />
              <Button variant="quiet" onClick={() => materials.remove(i)} aria-label={`Remove material ${i + 1}`}>Remove</Button>
            </div>
          ))}
          <Button variant="secondary" onClick={() => materials.append({ materialId: "", pricePerKg_cents: 0, scrapCreditPerKg_cents: 0 })}>Add a material</Button>
        </fieldset>
        <fieldset className="grid gap-4 sm:grid-cols-2">
          <legend className="mb-2 text-h4">Operations, margin</legend>
          {operations.map(([name, label]) => (
            <NumberInput key={name} register={register} errors={errors} name={name} label={label} />
          ))}
        </fieldset>
        <fieldset className="space-y-3">
          <legend className="text-h4">Quantity breaks</legend>
          {breaks.fields.length === 0 && <p className="text-flux-600">No quantity breaks: every quantity pays the list price.</p>}
          {breaks.fields.map((f, i) => (
            <div key={f.id} className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_auto]">
              <NumberInput register={register} errors={errors} name={`quantityBreaks.${i}.minQuantity`} label="From quantity" step="1" />
              <NumberInput register={register} errors={errors} name={`quantityBreaks.${i}.discountPercent`} label="Discount (%)" />
              <Button variant="quiet" onClick={() => breaks.remove(i)} aria-label={`Remove quantity break ${i + 1}`}>Remove</Button>
            </div>
          ))}
          <Button variant="secondary" onClick={() => breaks.append({ minQuantity: 1, discountPercent: 0 })}>Add a break</Button>
        </fieldset>
        <ConfirmSave what="prices" nextVersion={current.version + 1} pending={save.isPending} onConfirm={() => void submit()} />
      </form>
    </Panel>
  );
}
