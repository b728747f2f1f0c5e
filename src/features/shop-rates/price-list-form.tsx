import { useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { priceRatesSchema } from "../../../shared/schemas/shop-rates";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import type { MaterialRecord } from "../../api/materials";
import { EditRows } from "../../components/ui/edit-rows";
import { TextField } from "../../components/ui/field";
import { fixedUnitScale, moneyScale, percentOfOneScale, plainScale } from "../../components/ui/unit-input";
import { MaterialSelect, NumberInput, SaveBar, showServerFields, type SaveMessage } from "./form-bits";

type In = z.input<typeof priceRatesSchema>;
type Out = z.output<typeof priceRatesSchema>;

/** The operation rates, in the list's currency (kept in cents), with what each is charged per. */
const operations: Array<[keyof In & `${string}_cents`, string]> = [
  ["blankingPerPart_cents", "Blanking, per blank"],
  ["formingPerDrawStage_cents", "Forming, per draw stage"],
  ["formingPerBend_cents", "Forming, per bend"],
  ["processAnnealPerAnneal_cents", "Process anneal, each"],
  ["weldingPerMetre_cents", "Welding, per metre"],
  ["cleaningPerPart_cents", "Cleaning, per piece"],
  ["hydrogenAnnealPerLoad_cents", "Hydrogen anneal, per furnace load"],
  ["verificationPerSampledPart_cents", "Verification, per sampled part"],
  ["packingPerPart_cents", "Packing, per piece"],
  ["setupPerJob_cents", "Setup, per job"],
];

export function PriceListForm({ current, materials }: { current: ShopRates; materials: MaterialRecord[] }) {
  const save = useSaveShopRates();
  const [asking, setAsking] = useState<Out | null>(null);
  const [message, setMessage] = useState<SaveMessage>(null);
  const { register, handleSubmit, control, setError, reset, formState: { errors } } = useForm<In, unknown, Out>({ resolver: zodResolver(priceRatesSchema), defaultValues: current.priceList });
  const prices = useFieldArray({ control, name: "materials" });
  const breaks = useFieldArray({ control, name: "quantityBreaks" });
  const currency = useWatch({ control, name: "currency" });
  // amounts are typed in the list's currency; an unfinished code falls back to euros for the boxes
  const money = moneyScale(/^[A-Z]{3}$/.test(currency ?? "") ? currency! : "EUR");

  // checked first; then the second step names the version
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
      const saved = await save.mutateAsync({ part: "price-list", body: asking });
      reset(saved.priceList);
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}. New estimates are priced with it.` });
    } catch (error) {
      setMessage({ tone: "danger", text: showServerFields(error, setError) ?? "Some values were not accepted; see the messages beside them." });
    } finally {
      setAsking(null);
    }
  };

  return (
    <form onSubmit={ask} noValidate className="space-y-6" aria-label="Prices and operation rates">
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Currency (ISO 4217)" error={errors.currency?.message} {...register("currency")} className="max-w-32 font-mono" />
        <label className="flex min-h-touch items-center gap-2 self-end">
          <input type="checkbox" className="size-5" {...register("scrapCredit")} /> Credit offcuts at the scrap price
        </label>
      </div>
      <fieldset className="space-y-3">
        <legend className="text-h4">Material prices</legend>
        <EditRows
          caption="Material prices"
          columns={[
            { key: "material", header: "Material", track: "minmax(10rem,1.6fr)" },
            { key: "price", header: `Price per kg (${money.symbol})`, track: "minmax(8rem,1fr)" },
            { key: "scrap", header: `Scrap credit per kg (${money.symbol})`, track: "minmax(8rem,1fr)" },
          ]}
          rows={prices.fields}
          rowKey={(f) => f.id}
          renderRow={(_f, i, wide) => [
            <MaterialSelect key="m" control={control} errors={errors} name={`materials.${i}.materialId`} label={`Material, row ${i + 1}`} materials={materials} hideLabel={wide} />,
            <NumberInput key="p" control={control} errors={errors} name={`materials.${i}.pricePerKg_cents`} label={`Price per kg, row ${i + 1}`} scale={money} hideLabel={wide} />,
            <NumberInput key="s" control={control} errors={errors} name={`materials.${i}.scrapCreditPerKg_cents`} label={`Scrap credit per kg, row ${i + 1}`} scale={money} hideLabel={wide} />,
          ]}
          onRemove={(i) => prices.remove(i)}
          removeLabel={(i) => `Remove material price ${i + 1}`}
          onAdd={() => prices.append({ materialId: "", pricePerKg_cents: 0, scrapCreditPerKg_cents: 0 })}
          addLabel="Add a material price"
        />
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-h4">Operations, in {money.symbol}</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          {operations.map(([name, label]) => (
            <NumberInput key={name} control={control} errors={errors} name={name} label={label} scale={money} />
          ))}
          <NumberInput control={control} errors={errors} name="partsPerFurnaceLoad" label="Pieces per furnace load" scale={plainScale} />
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-h4">Margin and material use</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberInput control={control} errors={errors} name="marginPercent" label="Margin" scale={fixedUnitScale("%", "per cent")} hint="On the cost of every line; customers never see it." />
          <NumberInput control={control} errors={errors} name="fallbackUtilisation" label="Sheet use when no stock sheet fits" scale={percentOfOneScale} />
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-h4">Quotes</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <NumberInput control={control} errors={errors} name="leadTimeWorkingDays" label="Lead time quoted" scale={fixedUnitScale("working days", "working days")} hint="From payment to dispatch." />
          <NumberInput control={control} errors={errors} name="quoteValidityDays" label="Quotes hold their price for" scale={fixedUnitScale("days", "days")} />
        </div>
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-h4">Quantity breaks</legend>
        <EditRows
          caption="Quantity breaks"
          columns={[
            { key: "from", header: "From quantity", track: "minmax(7rem,1fr)" },
            { key: "discount", header: "Discount (%)", track: "minmax(7rem,1fr)" },
          ]}
          rows={breaks.fields}
          rowKey={(f) => f.id}
          empty={<p className="text-flux-600">No quantity breaks: every quantity pays the list price.</p>}
          renderRow={(_f, i, wide) => [
            <NumberInput key="q" control={control} errors={errors} name={`quantityBreaks.${i}.minQuantity`} label={`From quantity, break ${i + 1}`} scale={plainScale} hideLabel={wide} />,
            <NumberInput key="d" control={control} errors={errors} name={`quantityBreaks.${i}.discountPercent`} label={`Discount, break ${i + 1}`} scale={fixedUnitScale("%", "per cent")} hideLabel={wide} />,
          ]}
          onRemove={(i) => breaks.remove(i)}
          removeLabel={(i) => `Remove quantity break ${i + 1}`}
          onAdd={() => breaks.append({ minQuantity: 1, discountPercent: 0 })}
          addLabel="Add a break"
        />
      </fieldset>
      <SaveBar what="prices" nextVersion={current.version + 1} asking={asking !== null} pending={save.isPending} message={message} onConfirm={() => void confirm()} onCancel={() => setAsking(null)} />
    </form>
  );
}
