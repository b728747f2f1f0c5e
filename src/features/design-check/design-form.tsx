import type { ReactNode } from "react";
import { MAX_FREQUENCY_HZ } from "../../../shared/schemas/prediction";
import type { MaterialSummary } from "../../api/materials";
import { Button } from "../../components/ui/button";
import { SelectField } from "../../components/ui/field";
import { plainScale, quantityScale, UnitInput, unitOptions } from "../../components/ui/unit-input";
import type { EditKind } from "../../lib/use-search-state";
import {
  designFieldUnits, designFrequencyUnits, designLengthUnits, fmt, lengthUnitNames, MAX_LAYERS, MAX_PAGE_HOLES, newHole, newLayer,
  type DesignDraft, type DesignLengthUnit, type DraftErrors, type HoleDraft, type Kept, type LayerDraft, type Shape,
} from "./design-model";

interface Props {
  draft: DesignDraft;
  /** every change goes straight to the parent, which checks, predicts and writes the address bar */
  onChange: (next: DesignDraft, kind: EditKind) => void;
  /** the person left a box they typed in */
  onCommit: () => void;
  errors: DraftErrors;
  materials: MaterialSummary[];
  materialsError: boolean;
}

const CUSTOM = "__custom";

/** The design's inputs: every quantity through the one unit input, kept in canonical units. */
export function DesignForm({ draft, onChange, onCommit, errors, materials, materialsError }: Props) {
  const set = <K extends keyof DesignDraft>(key: K, value: DesignDraft[K], kind: EditKind = "commit") => onChange({ ...draft, [key]: value }, kind);
  const lengthScale = quantityScale("length", draft.units.length);
  const length = (key: "diameter_mm" | "length_mm" | "width_mm" | "depth_mm" | "height_mm", name: string, label: string) => (
    <UnitInput label={label} name={name} scale={lengthScale} value={draft[key]} error={errors[name]} onValueChange={(v) => set(key, v, "typing")} onCommit={onCommit} />
  );

  const setLayer = (i: number, patch: Partial<LayerDraft>, kind: EditKind = "commit") => set("layers", draft.layers.map((l, j) => (j === i ? { ...l, ...patch } : l)), kind);
  const move = (i: number, by: -1 | 1) => {
    const layers = [...draft.layers];
    [layers[i], layers[i + by]] = [layers[i + by], layers[i]];
    set("layers", layers);
  };
  const remove = (i: number) => set("layers", draft.layers.filter((_, j) => j !== i));
  const add = () => {
    const last = draft.layers[draft.layers.length - 1];
    set("layers", [...draft.layers, newLayer(last ? { kind: last.kind, material: last.material, mu_r: last.mu_r, resistivity_uohm_m: last.resistivity_uohm_m, saturation_T: last.saturation_T, thickness_mm: last.thickness_mm, gap_mm: last.gap_mm ?? 10 } : {})]);
  };

  const holes = draft.holes;
  const setHole = (i: number, patch: Partial<HoleDraft>) => set("holes", holes.map((h, j) => (j === i ? { ...h, ...patch } : h)), "typing");
  const removeHole = (i: number) => set("holes", holes.filter((_, j) => j !== i));
  const addHole = () => set("holes", [...holes, newHole()]);
  /** "2 hole diameters": the collar against the rule of thumb */
  const diameters = (h: HoleDraft) => {
    const d = h.diameter_mm, c = h.collar_mm ?? 0;
    if (d === null || !(d > 0) || !Number.isFinite(c) || c < 0) return undefined;
    return c === 0 ? "No collar: a plain hole." : `The collar is ${fmt(c / d, 2)} hole diameter${fmt(c / d, 2) === "1" ? "" : "s"} long.`;
  };
  const plain = (value: Kept, label: string, error: string | undefined, onValue: (v: Kept) => void, hint?: string, scale = plainScale) => (
    <UnitInput label={label} scale={scale} value={value} error={error} hint={hint} onValueChange={onValue} onCommit={onCommit} />
  );

  return (
    <form className="space-y-6" onSubmit={(e) => e.preventDefault()} noValidate aria-label="Shield design">
      <Section title="Shape and inside size">
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField label="Shape" name="shape" value={draft.shape} error={errors.shape} onChange={(e) => set("shape", e.target.value as Shape)}>
            <option value="cylinder">Cylinder (can)</option>
            <option value="box">Box</option>
            <option value="sphere">Sphere</option>
          </SelectField>
          <SelectField
            label="Lengths in"
            name="unit"
            value={draft.units.length}
            onChange={(e) => set("units", { ...draft.units, length: e.target.value as DesignLengthUnit })}
          >
            {designLengthUnits.map((u) => (
              <option key={u} value={u}>
                {lengthUnitNames[u]}
              </option>
            ))}
          </SelectField>
        </div>
        <div className="grid gap-4 sm:grid-cols-2">
          {draft.shape === "box" ? (
            <>
              {length("width_mm", "width", "Inside width")}
              {length("depth_mm", "depth", "Inside depth")}
              {length("height_mm", "height", "Inside height")}
            </>
          ) : (
            <>
              {length("diameter_mm", "diameter", "Inside diameter")}
              {draft.shape === "cylinder" && length("length_mm", "length", "Inside length")}
            </>
          )}
          {draft.shape === "cylinder" && (
            <div className="sm:col-span-2">
              <SelectField label="Ends" name="ends" value={draft.ends} error={errors.ends} onChange={(e) => set("ends", e.target.value as DesignDraft["ends"])}>
                <option value="closed">Closed (lid and bottom)</option>
                <option value="open">Open (tube)</option>
              </SelectField>
            </div>
          )}
        </div>
        <p className="text-meta text-flux-600">Inside dimensions of the innermost layer. Changing “Lengths in” shows the same design in that unit; it never changes it.</p>
        {draft.shape === "cylinder" ? (
          <SelectField
            label="How it is made"
            name="method"
            value={draft.method}
            error={errors.method}
            hint="The construction sets what a built shield reaches: its welds, its lid joint, and the shop's ceiling for it."
            onChange={(e) => set("method", e.target.value as DesignDraft["method"])}
          >
            <option value="drawn">Deep-drawn, seamless{draft.ends === "closed" ? ", slip-on lid" : ""}</option>
            <option value="rolled">Rolled and seam-welded{draft.ends === "closed" ? ", welded bottom, slip-on lid" : ""}</option>
          </SelectField>
        ) : (
          <p className="text-meta text-flux-600" data-testid="made-as">
            {draft.shape === "box" ? "Made bent from a cross-shaped blank, corners welded, with a slip-on lid." : "Figured as two drawn halves welded together (the shop does not make spheres)."}
          </p>
        )}
      </Section>

      <Section title="Layers, innermost first">
        {errors.layers && <p className="font-semibold text-danger-700">{errors.layers}</p>}
        {materialsError && <p className="text-meta text-danger-700">The material list could not be loaded; custom μr layers still work.</p>}
        <ol className="space-y-4">
          {draft.layers.map((l, i) => {
            const outermost = i === draft.layers.length - 1;
            const err = (f: string) => errors[`layers.${i}.${f}`];
            const position = draft.layers.length === 1 ? "the only layer" : i === 0 ? "innermost" : outermost ? "outermost" : "between";
            return (
              <li key={l.key}>
                <fieldset className="space-y-3 rounded-md border border-nickel-300 bg-nickel-50 p-3" aria-label={`Layer ${i + 1}`}>
                  <legend className="px-1 font-semibold text-flux-900">
                    Layer {i + 1} <span className="font-normal text-flux-600">· {position}</span>
                  </legend>
                  <SelectField
                    label="Material"
                    name={`layers.${i}.material`}
                    value={l.kind === "custom" ? CUSTOM : l.material}
                    error={err("material")}
                    onChange={(e) => setLayer(i, e.target.value === CUSTOM ? { kind: "custom" } : { kind: "library", material: e.target.value })}
                  >
                    {materials.length === 0 && <option value={l.material}>{l.material}</option>}
                    {materials.map((m) => (
                      <option key={m.id} value={m.id}>
                        {m.id} · {m.name}
                      </option>
                    ))}
                    <option value={CUSTOM}>Custom: my own μr and resistivity</option>
                  </SelectField>
                  {l.kind === "custom" && (
                    <div className="grid gap-3 sm:grid-cols-3">
                      {plain(l.mu_r, "μr (relative permeability)", err("mu_r"), (v) => setLayer(i, { mu_r: v }, "typing"))}
                      {plain(l.resistivity_uohm_m, "Resistivity (µΩ·m)", err("resistivity"), (v) => setLayer(i, { resistivity_uohm_m: v }, "typing"))}
                      {plain(l.saturation_T, "Saturation (T)", err("saturation"), (v) => setLayer(i, { saturation_T: v }, "typing"), "Empty if non-magnetic.")}
                    </div>
                  )}
                  <div className="grid gap-3 sm:grid-cols-2">
                    <UnitInput label="Wall thickness" scale={lengthScale} value={l.thickness_mm} error={err("thickness")} onValueChange={(v) => setLayer(i, { thickness_mm: v }, "typing")} onCommit={onCommit} />
                    {!outermost && (
                      <UnitInput label={`Gap to layer ${i + 2}`} scale={lengthScale} value={l.gap_mm} error={err("gap")} onValueChange={(v) => setLayer(i, { gap_mm: v }, "typing")} onCommit={onCommit} />
                    )}
                  </div>
                  <div className="flex flex-wrap gap-2">
                    <Button variant="quiet" className="min-h-9 px-2 text-meta" disabled={i === 0} onClick={() => move(i, -1)} aria-label={`Move layer ${i + 1} inward`}>
                      ↑ Inward
                    </Button>
                    <Button variant="quiet" className="min-h-9 px-2 text-meta" disabled={outermost} onClick={() => move(i, 1)} aria-label={`Move layer ${i + 1} outward`}>
                      ↓ Outward
                    </Button>
                    <Button variant="quiet" className="min-h-9 px-2 text-meta" disabled={draft.layers.length === 1} onClick={() => remove(i)} aria-label={`Remove layer ${i + 1}`}>
                      Remove
                    </Button>
                  </div>
                </fieldset>
              </li>
            );
          })}
        </ol>
        <Button variant="secondary" onClick={add} disabled={draft.layers.length >= MAX_LAYERS}>
          Add a layer outside
        </Button>
        <SelectField label="State of the metal" name="state" value={draft.state} error={errors.state} onChange={(e) => set("state", e.target.value as DesignDraft["state"])}>
          <option value="annealed">Annealed (after the final hydrogen anneal)</option>
          <option value="as-formed">As formed (not yet annealed)</option>
        </SelectField>
      </Section>

      <Section title="Cable holes">
        <p className="text-meta text-flux-600" data-testid="holes-hint">
          Each hole goes through every layer, with a collar (a short tube) round it on each one. A collar 1–2 hole diameters long is the usual practice; the results say what this design needs.
        </p>
        {errors.holes && <p className="font-semibold text-danger-700">{errors.holes}</p>}
        {holes.length > 0 && (
          <ol className="space-y-4">
            {holes.map((h, i) => {
              const err = (f: string) => errors[`holes.${i}.${f}`];
              const ratio = diameters(h);
              return (
                <li key={h.key}>
                  <fieldset className="space-y-3 rounded-md border border-nickel-300 bg-nickel-50 p-3" aria-label={`Hole ${i + 1}`}>
                    <legend className="px-1 font-semibold text-flux-900">Hole {i + 1}</legend>
                    <div className="grid items-start gap-3 sm:grid-cols-2">
                      <UnitInput label="Hole diameter" scale={lengthScale} value={h.diameter_mm} error={err("diameter")} onValueChange={(v) => setHole(i, { diameter_mm: v })} onCommit={onCommit} />
                      <UnitInput label="Collar length" scale={lengthScale} value={h.collar_mm} error={err("collar")} onValueChange={(v) => setHole(i, { collar_mm: v })} onCommit={onCommit} />
                    </div>
                    <p className="text-meta text-flux-600">{ratio ?? "Empty or 0: a plain hole, no collar."}</p>
                    <Button variant="quiet" className="min-h-9 px-2 text-meta" onClick={() => removeHole(i)} aria-label={`Remove hole ${i + 1}`}>
                      Remove
                    </Button>
                  </fieldset>
                </li>
              );
            })}
          </ol>
        )}
        <Button variant="secondary" onClick={addHole} disabled={holes.length >= MAX_PAGE_HOLES}>
          Add a cable hole
        </Button>
      </Section>

      <Section title="The field to block">
        <UnitInput
          label="Peak field"
          name="amplitude"
          scale={quantityScale("flux", draft.units.field)}
          value={draft.amplitude_uT}
          error={errors.amplitude}
          hint="Switching the unit shows the same field in it."
          onValueChange={(v) => set("amplitude_uT", v, "typing")}
          onCommit={onCommit}
          unitSelect={{ value: draft.units.field, options: unitOptions.flux(designFieldUnits), onChange: (u) => set("units", { ...draft.units, field: u as DesignDraft["units"]["field"] }) }}
        />
        <UnitInput
          label="Frequency"
          name="frequency"
          scale={quantityScale("frequency", draft.units.frequency)}
          value={draft.frequency_hz}
          error={errors.frequency}
          hint={`0 for a static field; the model covers 0 to ${(MAX_FREQUENCY_HZ / 1000).toLocaleString("en-GB")} kHz.`}
          onValueChange={(v) => set("frequency_hz", v, "typing")}
          onCommit={onCommit}
          unitSelect={{ value: draft.units.frequency, options: unitOptions.frequency(designFrequencyUnits), onChange: (u) => set("units", { ...draft.units, frequency: u as DesignDraft["units"]["frequency"] }) }}
        />
        {draft.shape === "cylinder" ? (
          <SelectField label="Field direction" name="orientation" value={draft.orientation} error={errors.orientation} onChange={(e) => set("orientation", e.target.value as DesignDraft["orientation"])}>
            <option value="transverse">Across the axis (transverse)</option>
            <option value="axial">Along the axis (axial)</option>
          </SelectField>
        ) : (
          <p className="text-meta text-flux-600">{draft.shape === "box" ? "A box's figure is taken for its weakest field direction." : "A sphere shields every direction alike."}</p>
        )}
      </Section>
    </form>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="space-y-4">
      <legend className="mb-3 text-h4">{title}</legend>
      {children}
    </fieldset>
  );
}
