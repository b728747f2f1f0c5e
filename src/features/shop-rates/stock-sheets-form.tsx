import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { stockSheetsUpdateSchema } from "../../../shared/schemas/shop-rates";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import type { MaterialRecord } from "../../api/materials";
import { EditRows } from "../../components/ui/edit-rows";
import { quantityScale } from "../../components/ui/unit-input";
import { MaterialSelect, NumberInput, SaveBar, showServerFields, type SaveMessage } from "./form-bits";

type In = z.input<typeof stockSheetsUpdateSchema>;
type Out = z.output<typeof stockSheetsUpdateSchema>;
const mm = quantityScale("length", "mm");

export function StockSheetsForm({ current, materials }: { current: ShopRates; materials: MaterialRecord[] }) {
  const save = useSaveShopRates();
  const [asking, setAsking] = useState<Out | null>(null);
  const [message, setMessage] = useState<SaveMessage>(null);
  const { handleSubmit, control, setError, reset, formState: { errors } } = useForm<In, unknown, Out>({ resolver: zodResolver(stockSheetsUpdateSchema), defaultValues: { stockSheets: current.stockSheets } });
  const sheets = useFieldArray({ control, name: "stockSheets" });
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
      const saved = await save.mutateAsync({ part: "stock-sheets", body: asking });
      reset({ stockSheets: saved.stockSheets });
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}.` });
    } catch (error) {
      setMessage({ tone: "danger", text: showServerFields(error, setError) ?? "Some values were not accepted; see the messages beside them." });
    } finally {
      setAsking(null);
    }
  };
  return (
    <form onSubmit={ask} noValidate className="space-y-4" aria-label="Stock sheets">
      <p className="text-meta text-flux-600">The sheet sizes the shop keeps, per alloy and gauge; blanks are nested on them to price the material and its offcut, and the flat-blank page warns when a part is larger than all of them.</p>
      <EditRows
        caption="Stock sheets"
        columns={[
          { key: "material", header: "Material", track: "minmax(10rem,1.6fr)" },
          { key: "gauge", header: "Gauge (mm)", track: "minmax(6rem,1fr)" },
          { key: "width", header: "Width (mm)", track: "minmax(6rem,1fr)" },
          { key: "length", header: "Length (mm)", track: "minmax(6rem,1fr)" },
        ]}
        rows={sheets.fields}
        rowKey={(f) => f.id}
        empty={<p className="text-flux-600">No sheets listed: every material is priced at the assumed sheet use.</p>}
        renderRow={(_f, i, wide) => [
          <MaterialSelect key="m" control={control} errors={errors} name={`stockSheets.${i}.materialId`} label={`Material, sheet ${i + 1}`} materials={materials} hideLabel={wide} />,
          <NumberInput key="t" control={control} errors={errors} name={`stockSheets.${i}.thickness_mm`} label={`Gauge, sheet ${i + 1}`} scale={mm} hideLabel={wide} />,
          <NumberInput key="w" control={control} errors={errors} name={`stockSheets.${i}.width_mm`} label={`Width, sheet ${i + 1}`} scale={mm} hideLabel={wide} />,
          <NumberInput key="l" control={control} errors={errors} name={`stockSheets.${i}.length_mm`} label={`Length, sheet ${i + 1}`} scale={mm} hideLabel={wide} />,
        ]}
        onRemove={(i) => sheets.remove(i)}
        removeLabel={(i) => `Remove sheet ${i + 1}`}
        onAdd={() => sheets.append({ materialId: "", thickness_mm: 1, width_mm: 1000, length_mm: 2000 })}
        addLabel="Add a sheet size"
      />
      <SaveBar what="stock sheets" nextVersion={current.version + 1} asking={asking !== null} pending={save.isPending} message={message} onConfirm={() => void confirm()} onCancel={() => setAsking(null)} />
    </form>
  );
}
