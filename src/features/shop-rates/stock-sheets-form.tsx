import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { stockSheetsUpdateSchema } from "../../../shared/schemas/shop-rates";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { StatusNote } from "../../components/ui/status-note";
import { ConfirmSave, NumberInput, showServerFields } from "./form-bits";

type In = z.input<typeof stockSheetsUpdateSchema>;
type Out = z.output<typeof stockSheetsUpdateSchema>;

export function StockSheetsForm({ current }: { current: ShopRates }) {
  const save = useSaveShopRates();
  const [message, setMessage] = useState<{ tone: "ok" | "danger"; text: string } | null>(null);
  const { register, handleSubmit, control, setError, reset, formState: { errors } } = useForm<In, unknown, Out>({ resolver: zodResolver(stockSheetsUpdateSchema), defaultValues: { stockSheets: current.stockSheets } });
  const sheets = useFieldArray({ control, name: "stockSheets" });
  const submit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const saved = await save.mutateAsync({ part: "stock-sheets", body: values });
      reset({ stockSheets: saved.stockSheets });
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}.` });
    } catch (error) {
      setMessage({ tone: "danger", text: showServerFields(error, setError) ?? "Some values were not accepted; see the fields." });
    }
  });
  return (
    <Panel title="Stock sheets">
      <form onSubmit={(e) => e.preventDefault()} noValidate className="space-y-4" aria-label="Stock sheets">
        {message && <StatusNote tone={message.tone} word={message.tone === "ok" ? "Saved" : "Not saved"}>{message.text}</StatusNote>}
        <p className="text-meta text-flux-600">The sheet sizes the shop keeps, per alloy and gauge; blanks are nested on them to price the material and its scrap.</p>
        {sheets.fields.length === 0 && <p className="text-flux-600">No sheets listed: every material is priced at the assumed utilisation.</p>}
        {sheets.fields.map((f, i) => (
          <div key={f.id} className="grid items-end gap-3 border-b border-nickel-100 pb-3 sm:grid-cols-[1fr_1fr_1fr_1fr_auto]">
            <TextField label="Material id" error={errors.stockSheets?.[i]?.materialId?.message} {...register(`stockSheets.${i}.materialId`)} />
            <NumberInput register={register} errors={errors} name={`stockSheets.${i}.thickness_mm`} label="Gauge (mm)" />
            <NumberInput register={register} errors={errors} name={`stockSheets.${i}.width_mm`} label="Width (mm)" />
            <NumberInput register={register} errors={errors} name={`stockSheets.${i}.length_mm`} label="Length (mm)" />
            <Button variant="quiet" onClick={() => sheets.remove(i)} aria-label={`Remove sheet ${i + 1}`}>Remove</Button>
          </div>
        ))}
        <Button variant="secondary" onClick={() => sheets.append({ materialId: "", thickness_mm: 1, width_mm: 1000, length_mm: 2000 })}>Add a sheet size</Button>
        <ConfirmSave what="stock sheets" nextVersion={current.version + 1} pending={save.isPending} onConfirm={() => void submit()} />
      </form>
    </Panel>
  );
}
