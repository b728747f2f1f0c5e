import { useState } from "react";
import { useFieldArray, useForm, get } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { materialCreateSchema, TAGGED_VALUES, tagLabels } from "../../../shared/schemas/material";
import { ApiError } from "../../api/client";
import { useSaveMaterial, type MaterialRecord } from "../../api/materials";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { StatusNote } from "../../components/ui/status-note";

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
export function MaterialForm({ material, onSaved, onCancel }: { material: MaterialRecord | null; onSaved: (id: string) => void; onCancel: () => void }) {
  const editing = material !== null;
  const save = useSaveMaterial();
  const [asking, setAsking] = useState<Out | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, control, setError, formState: { errors } } = useForm<In, unknown, Out>({ resolver: zodResolver(materialCreateSchema), defaultValues: material ? toForm(material) : blank });
  const curve = useFieldArray({ control, name: "muCurve" });
  const err = (name: string) => (get(errors, name) as { message?: string } | undefined)?.message;
  const num = (name: Parameters<typeof register>[0], label: string, hint?: string) => (
    <TextField label={label} hint={hint} inputMode="decimal" type="text" error={err(name)} {...register(name, { setValueAs: (v: unknown) => (v === "" || v == null ? NaN : Number(v)) })} />
  );

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
    <Panel title={editing ? `Edit ${material.id}` : "Add a material"}>
      <form className="space-y-5" noValidate onSubmit={handleSubmit((values) => setAsking(values))} aria-label={editing ? `Edit ${material.id}` : "New material"}>
        {message && (
          <StatusNote tone="danger" word="Not saved" assertive>
            {message}
          </StatusNote>
        )}
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Id" readOnly={editing} className={editing ? "bg-nickel-100" : ""} hint={editing ? undefined : "Lower-case letters, digits, dashes: ni80."} error={err("id")} {...register("id")} />
          <TextField label="Name" error={err("name")} {...register("name")} />
          {num("relativePermeability.initial", "Initial μr")}
          {num("relativePermeability.maximum", "Maximum μr")}
          <TextField label="Saturation (T)" hint="Empty for a non-magnetic metal." inputMode="decimal" error={err("saturation_T")} {...register("saturation_T", { setValueAs: (v: unknown) => (v === "" || v == null ? null : Number(v)) })} />
          {num("resistivity_ohm_m", "Resistivity (Ω·m)", "e.g. 5.8e-7 for 0.58 µΩ·m")}
          {num("density_kg_m3", "Density (kg/m³)")}
          {num("asFormedFactor", "As-formed factor", "μ before the final anneal ÷ μ after; 0 to 1.")}
        </div>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="size-5" {...register("active")} /> In use (offered on the design check)
        </label>
        <fieldset className="space-y-3">
          <legend className="text-h4">Annealed μ(B) curve</legend>
          {err("muCurve") && <p className="font-semibold text-danger-700">{err("muCurve")}</p>}
          {curve.fields.map((f, i) => (
            <div key={f.id} className="grid items-end gap-3 sm:grid-cols-[1fr_1fr_auto]">
              {num(`muCurve.${i}.B_T`, `Point ${i + 1}: B (T)`)}
              {num(`muCurve.${i}.mu_r`, `Point ${i + 1}: μr`)}
              <Button variant="quiet" onClick={() => curve.remove(i)} disabled={curve.fields.length === 1} aria-label={`Remove point ${i + 1}`}>
                Remove
              </Button>
            </div>
          ))}
          <Button variant="secondary" onClick={() => curve.append({ B_T: 1, mu_r: 1 })}>
            Add a point
          </Button>
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
      </form>
    </Panel>
  );
}
