import { useEffect, useRef, useState } from "react";
import { useFieldArray, useForm, useWatch, get } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { materialCreateSchema, TAGGED_VALUES, tagLabels } from "../../../shared/schemas/material";
import { ApiError } from "../../api/client";
import { useSaveMaterial, type MaterialRecord } from "../../api/materials";
import { ControlledUnitInput } from "../../components/forms/controlled-unit-input";
import { Button } from "../../components/ui/button";
import { EditRows } from "../../components/ui/edit-rows";
import { TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { StatusNote } from "../../components/ui/status-note";
import { factorScale, fixedUnitScale, plainScale } from "../../components/ui/unit-input";
import { MuCurvePlot } from "./mu-curve-plot";

const tesla = fixedUnitScale("T", "tesla");
const microOhmMetre = factorScale("µΩ·m", 1e-6, "microhm-metres");
const kgPerCubicMetre = fixedUnitScale("kg/m³", "kilograms per cubic metre");

type In = z.input<typeof materialCreateSchema>;
type Out = z.output<typeof materialCreateSchema>;

const blank: In = {
  id: "",
  name: "",
  relativePermeability: { initial: 1, maximum: 1 },
  saturation_T: null,
  resistivity_ohm_m: 1e-7,
  density_kg_m3: 8000,
  muCurve: [{ B_T: 0.01, mu_r: 1 }],
  asFormedFactor: 1,
  source: "",
  sourceTags: Object.fromEntries(TAGGED_VALUES.map((k) => [k, ""])) as In["sourceTags"],
  active: true,
};

const toForm = (m: MaterialRecord): In => ({
  id: m.id,
  name: m.name,
  relativePermeability: m.relativePermeability,
  saturation_T: m.saturation_T,
  resistivity_ohm_m: m.resistivity_ohm_m,
  density_kg_m3: m.density_kg_m3,
  muCurve: m.muCurve,
  asFormedFactor: m.asFormedFactor,
  source: m.source,
  sourceTags: { ...blank.sourceTags, ...m.sourceTags } as In["sourceTags"],
  active: m.active,
});

/** Edit one material (or add one), checked with the server's schema, saved only after a second click. */
export function MaterialForm({ material, saved, onSaved, onCancel }: { material: MaterialRecord | null; saved: string | null; onSaved: (id: string) => void; onCancel: () => void }) {
  const editing = material !== null;
  const save = useSaveMaterial();
  const [asking, setAsking] = useState<Out | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, control, setError, setFocus, formState: { errors } } = useForm<In, unknown, Out>({ resolver: zodResolver(materialCreateSchema), defaultValues: material ? toForm(material) : blank });
  const curve = useFieldArray({ control, name: "muCurve" });
  const points = useWatch({ control, name: "muCurve" });
  const err = (name: string) => (get(errors, name) as { message?: string } | undefined)?.message;
  const panel = useRef<HTMLDivElement>(null);
  // opened from the list: brought into view and the first box to edit focused, wherever the list left the page
  const opened = useRef(editing);
  useEffect(() => {
    panel.current?.scrollIntoView({ block: "start" });
    setFocus(opened.current ? "name" : "id");
  }, [setFocus]);

  const confirm = async () => {
    if (!asking) return;
    setMessage(null);
    try {
      const { id, ...body } = asking;
      const saved = await save.mutateAsync(editing ? { id: material.id, body } : { id: null, body: { id, ...body } });
      setAsking(null);
      onSaved(saved.id);
    } catch (error) {
      setAsking(null);
      if (error instanceof ApiError) {
        for (const [path, text] of Object.entries(error.fields)) setError(path as Parameters<typeof setError>[0], { type: "server", message: text });
        setMessage(Object.keys(error.fields).length ? "Some values were not accepted; see the fields." : error.message);
      } else setMessage("Something went wrong. Try again.");
    }
  };

  return (
    <div ref={panel} className="scroll-mt-4" data-testid="material-form">
    <Panel title={editing ? `Edit ${material.id}` : "Add a material"}>
      <form className="space-y-5" noValidate onSubmit={handleSubmit((values) => { setMessage(null); setAsking(values); }, () => setMessage("Some values need attention; see the messages beside them."))} aria-label={editing ? `Edit ${material.id}` : "New material"}>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Id" readOnly={editing} className={editing ? "bg-nickel-100" : ""} hint={editing ? undefined : "Lower-case letters, digits, dashes: ni80."} error={err("id")} {...register("id")} />
          <TextField label="Name" error={err("name")} {...register("name")} />
          <ControlledUnitInput control={control} errors={errors} name="relativePermeability.initial" label="Initial μr" scale={plainScale} />
          <ControlledUnitInput control={control} errors={errors} name="relativePermeability.maximum" label="Maximum μr" scale={plainScale} />
          <ControlledUnitInput control={control} errors={errors} name="saturation_T" label="Saturation" scale={tesla} hint="Empty for a non-magnetic metal." />
          <ControlledUnitInput control={control} errors={errors} name="resistivity_ohm_m" label="Resistivity" scale={microOhmMetre} hint="As data sheets give it: 0.58 for 80 % nickel-iron." />
          <ControlledUnitInput control={control} errors={errors} name="density_kg_m3" label="Density" scale={kgPerCubicMetre} />
          <ControlledUnitInput control={control} errors={errors} name="asFormedFactor" label="As-formed factor" scale={plainScale} hint="μ before the final anneal ÷ μ after; 0 to 1." />
        </div>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="size-5" {...register("active")} /> In use (offered on the design check)
        </label>
        <fieldset className="space-y-3">
          <legend className="text-h4">Annealed μ(B) curve</legend>
          {err("muCurve") && <p className="font-semibold text-danger-700">{err("muCurve")}</p>}
          <MuCurvePlot curve={(points ?? []).filter((p) => typeof p?.B_T === "number" && typeof p?.mu_r === "number" && Number.isFinite(p.B_T) && Number.isFinite(p.mu_r))} name={editing ? material.id : "the new material"} />
          <EditRows
            caption="Points of the μ(B) curve"
            columns={[
              { key: "B", header: "Flux density B (T)", track: "minmax(7rem,1fr)" },
              { key: "mu", header: "μr", track: "minmax(7rem,1fr)" },
            ]}
            cardsBelow={420}
            rows={curve.fields}
            rowKey={(f) => f.id}
            renderRow={(_f, i, wide) => [
              <ControlledUnitInput key="b" control={control} errors={errors} name={`muCurve.${i}.B_T`} label={`Point ${i + 1}: flux density`} scale={tesla} hideLabel={wide} />,
              <ControlledUnitInput key="m" control={control} errors={errors} name={`muCurve.${i}.mu_r`} label={`Point ${i + 1}: μr`} scale={plainScale} hideLabel={wide} />,
            ]}
            onRemove={(i) => curve.fields.length > 1 && curve.remove(i)}
            removeLabel={(i) => `Remove point ${i + 1}`}
            onAdd={() => curve.append({ B_T: 1, mu_r: 1 })}
            addLabel="Add a point"
          />
        </fieldset>
        <fieldset className="space-y-3">
          <legend className="text-h4">Where each value comes from</legend>
          <p className="text-meta text-flux-600">Mark each: [pub] published, [practice] common practice, [memory] from memory, [derived] worked out.</p>
          {TAGGED_VALUES.map((k) => (
            <TextField key={k} label={tagLabels[k]} error={err(`sourceTags.${k}`)} {...register(`sourceTags.${k}`)} />
          ))}
          <label className="block space-y-1.5">
            <span className="block font-semibold text-flux-900">Sources (full text)</span>
            <textarea rows={3} className="block w-full rounded-md border border-nickel-400 px-3 py-2" aria-invalid={!!err("source")} {...register("source")} />
            {err("source") && <span className="text-meta font-semibold text-danger-700">{err("source")}</span>}
          </label>
        </fieldset>
        {asking ? (
          <div className="space-y-3" role="group" aria-label="Confirm saving">
            <StatusNote tone="caution" word="Confirm">
              {editing ? `Saving changes ${material.id} for every prediction and blank from now on.` : `Adding ${asking.id} offers it on the design check at once.`} The change is recorded with its before and after.
            </StatusNote>
            <div className="flex gap-3">
              <Button pending={save.isPending} pendingLabel="Saving…" onClick={() => void confirm()}>
                {editing ? `Save ${material.id}` : `Add ${asking.id}`}
              </Button>
              <Button variant="secondary" onClick={() => setAsking(null)}>
                Back to the form
              </Button>
            </div>
          </div>
        ) : (
          <div className="flex gap-3">
            <Button type="submit">{editing ? "Save changes…" : "Add material…"}</Button>
            <Button variant="secondary" onClick={onCancel}>
              Cancel
            </Button>
          </div>
        )}
        {/* the outcome where the buttons are, where the person is looking */}
        {saved && !asking && !message && (
          <StatusNote tone="ok" word="Saved" live="polite">
            {saved} is saved; predictions use it from now on. The change heads its list of changes.
          </StatusNote>
        )}
        {message && (
          <StatusNote tone="danger" word="Not saved" live="assertive">
            {message}
          </StatusNote>
        )}
      </form>
    </Panel>
    </div>
  );
}
