import type { ReactNode } from "react";
import { MAX_FREQUENCY_HZ, MAX_LAYERS } from "../../../shared/schemas/prediction";
import { fromMillimetres, toMillimetres } from "../../../shared/units";
import type { MaterialSummary } from "../../api/materials";
import { Button } from "../../components/ui/button";
import { SelectField, TextField } from "../../components/ui/field";
import {
  designFieldUnits, designLengthUnits, fieldUnitNames, fmt, lengthUnitNames, MAX_PAGE_HOLES, newHole, newLayer,
  type DesignDraft, type DesignFieldUnit, type DesignLengthUnit, type DraftErrors, type HoleDraft, type LayerDraft, type Shape,
} from "./design-model";

interface Props {
  draft: DesignDraft;
  onChange: (next: DesignDraft) => void;
  errors: DraftErrors;
  materials: MaterialSummary[];
  materialsError: boolean;
}

const CUSTOM = "__custom";

/** Four figures when they are as good as exact, else six. */
function tidy(x: number): number {
  const short = +x.toPrecision(4);
  return Math.abs(short - x) <= 1e-4 * Math.abs(x) ? short : +x.toPrecision(6);
}

/**
 * Switching the unit keeps the shield the same size: every typed length is converted. The exact
 * millimetres behind a converted figure are remembered while it is left as it is, so switching
 * back gives 60, not 59.99.
 */
function inUnit(d: DesignDraft, unit: DesignLengthUnit): DesignDraft {
  const exact: NonNullable<DesignDraft["exact"]> = {};
  const conv = (key: string, s: string) => {
    const v = Number(s.trim().replace(",", "."));
    if (s.trim() === "" || !Number.isFinite(v)) return s;
    const known = d.exact?.[key];
    const mm = known && known.text === s ? known.mm : toMillimetres(v, d.unit);
    const text = String(tidy(fromMillimetres(mm, unit)));
    exact[key] = { text, mm };
    return text;
  };
  return {
    ...d,
    unit,
    diameter: conv("diameter", d.diameter), length: conv("length", d.length), width: conv("width", d.width), depth: conv("depth", d.depth), height: conv("height", d.height),
    layers: d.layers.map((l) => ({ ...l, thickness: conv(`${l.key}.thickness`, l.thickness), gap: conv(`${l.key}.gap`, l.gap) })),
    ...(d.holes ? { holes: d.holes.map((h) => ({ ...h, diameter: conv(`${h.key}.diameter`, h.diameter), collar: conv(`${h.key}.collar`, h.collar) })) } : {}),
    exact,
  };
}

/** The design's inputs. Every change goes straight to the parent, which checks and predicts. */
export function DesignForm({ draft, onChange, errors, materials, materialsError }: Props) {
  const set = <K extends keyof DesignDraft>(key: K, value: DesignDraft[K]) => onChange({ ...draft, [key]: value });
  const unitLabel = draft.unit === "mm" ? "mm" : draft.unit;
  const inMm = (s: string) => {
    if (draft.unit === "mm") return undefined;
    const v = Number(s.replace(",", "."));
    return s.trim() !== "" && Number.isFinite(v) ? `= ${fmt(toMillimetres(v, draft.unit), 4)} mm` : undefined;
  };
  const length = (name: "diameter" | "length" | "width" | "depth" | "height", label: string) => (
    <TextField
      label={`${label} (${unitLabel})`}
      name={name}
      inputMode="decimal"
      autoComplete="off"
      value={draft[name]}
      hint={inMm(draft[name])}
      error={errors[name]}
      onChange={(e) => set(name, e.target.value)}
    />
  );

  const setLayer = (i: number, patch: Partial<LayerDraft>) => set("layers", draft.layers.map((l, j) => (j === i ? { ...l, ...patch } : l)));
  const move = (i: number, by: -1 | 1) => {
    const layers = [...draft.layers];
    [layers[i], layers[i + by]] = [layers[i + by], layers[i]];
    set("layers", layers);
  };
  const remove = (i: number) => set("layers", draft.layers.filter((_, j) => j !== i));
  const add = () => {
    const last = draft.layers[draft.layers.length - 1];
    set("layers", [...draft.layers, newLayer(last ? { kind: last.kind, material: last.material, thickness: last.thickness, gap: last.gap || "10" } : {})]);
  };

  const holes = draft.holes ?? [];
  const setHole = (i: number, patch: Partial<HoleDraft>) => set("holes", holes.map((h, j) => (j === i ? { ...h, ...patch } : h)));
  const removeHole = (i: number) => set("holes", holes.filter((_, j) => j !== i));
  const addHole = () => set("holes", [...holes, newHole(draft.unit)]);
  /** "2 hole diameters": the collar against the rule of thumb, in the person's own numbers */
  const diameters = (h: HoleDraft) => {
    const d = Number(h.diameter.replace(",", ".")), c = h.collar.trim() === "" ? 0 : Number(h.collar.replace(",", "."));
    if (!(d > 0) || !Number.isFinite(c) || c < 0) return undefined;
    return c === 0 ? "No collar: a plain hole." : `The collar is ${fmt(c / d, 2)} hole diameter${fmt(c / d, 2) === "1" ? "" : "s"} long.`;
  };

  return (
    <form className="space-y-6" onSubmit={(e) => e.preventDefault()} noValidate aria-label="Shield design">
      <Section title="Shape and inside size">
        <div className="grid gap-4 sm:grid-cols-2 md:grid-cols-1 xl:grid-cols-2">
          <SelectField label="Shape" name="shape" value={draft.shape} error={errors.shape} onChange={(e) => set("shape", e.target.value as Shape)}>
            <option value="cylinder">Cylinder (can)</option>
            <option value="box">Box</option>
            <option value="sphere">Sphere</option>
          </SelectField>
          <SelectField label="Lengths in" name="unit" value={draft.unit} onChange={(e) => onChange(inUnit(draft, e.target.value as DesignLengthUnit))}>
            {designLengthUnits.map((u) => (
              <option key={u} value={u}>
                {lengthUnitNames[u]}
              </option>
            ))}
          </SelectField>
        </div>
        <div className="grid gap-4 sm:grid-cols-2 md:grid-cols-1 xl:grid-cols-2">
          {draft.shape === "box" ? (
            <>
              {length("width", "Inside width")}
              {length("depth", "Inside depth")}
              {length("height", "Inside height")}
            </>
          ) : (
            <>
              {length("diameter", "Inside diameter")}
              {draft.shape === "cylinder" && length("length", "Inside length")}
            </>
          )}
          {draft.shape === "cylinder" && (
            <div className="sm:col-span-2 md:col-span-1 xl:col-span-2">
              <SelectField label="Ends" name="ends" value={draft.ends} error={errors.ends} onChange={(e) => set("ends", e.target.value as DesignDraft["ends"])}>
                <option value="closed">Closed (lid and bottom)</option>
                <option value="open">Open (tube)</option>
              </SelectField>
            </div>
          )}
        </div>
        <p className="text-meta text-flux-600">Inside dimensions of the innermost layer.</p>
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
                    <div className="grid gap-3 sm:grid-cols-3 md:grid-cols-1">
                      <TextField label="μr (relative permeability)" inputMode="decimal" autoComplete="off" value={l.mu_r} error={err("mu_r")} onChange={(e) => setLayer(i, { mu_r: e.target.value })} />
                      <TextField label="Resistivity (µΩ·m)" inputMode="decimal" autoComplete="off" value={l.resistivity} error={err("resistivity")} onChange={(e) => setLayer(i, { resistivity: e.target.value })} />
                      <TextField label="Saturation (T)" hint="Empty if non-magnetic." inputMode="decimal" autoComplete="off" value={l.saturation} error={err("saturation")} onChange={(e) => setLayer(i, { saturation: e.target.value })} />
                    </div>
                  )}
                  <div className="grid gap-3 sm:grid-cols-2 md:grid-cols-1 xl:grid-cols-2">
                    <TextField label={`Wall thickness (${unitLabel})`} inputMode="decimal" autoComplete="off" value={l.thickness} hint={inMm(l.thickness)} error={err("thickness")} onChange={(e) => setLayer(i, { thickness: e.target.value })} />
                    {!outermost && (
                      <TextField label={`Gap to layer ${i + 2} (${unitLabel})`} inputMode="decimal" autoComplete="off" value={l.gap} hint={inMm(l.gap)} error={err("gap")} onChange={(e) => setLayer(i, { gap: e.target.value })} />
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
                    <div className="grid items-start gap-3 sm:grid-cols-2 md:grid-cols-1 xl:grid-cols-2">
                      <TextField label={`Hole diameter (${unitLabel})`} inputMode="decimal" autoComplete="off" value={h.diameter} hint={inMm(h.diameter)} error={err("diameter")} onChange={(e) => setHole(i, { diameter: e.target.value })} />
                      <TextField label={`Collar length (${unitLabel})`} inputMode="decimal" autoComplete="off" value={h.collar} hint={inMm(h.collar)} error={err("collar")} onChange={(e) => setHole(i, { collar: e.target.value })} />
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
        <div className="grid gap-4 sm:grid-cols-[1fr_auto]">
          <TextField label="Peak field" name="amplitude" inputMode="decimal" autoComplete="off" value={draft.amplitude} error={errors.amplitude} onChange={(e) => set("amplitude", e.target.value)} />
          <SelectField label="Unit" name="fieldUnit" value={draft.fieldUnit} onChange={(e) => set("fieldUnit", e.target.value as DesignFieldUnit)}>
            {designFieldUnits.map((u) => (
              <option key={u} value={u}>
                {fieldUnitNames[u]}
              </option>
            ))}
          </SelectField>
        </div>
        <TextField
          label="Frequency (Hz)"
          name="frequency"
          inputMode="decimal"
          autoComplete="off"
          value={draft.frequency}
          hint={`0 for a static field; the model covers 0 to ${(MAX_FREQUENCY_HZ / 1000).toLocaleString("en-GB")} kHz.`}
          error={errors.frequency}
          onChange={(e) => set("frequency", e.target.value)}
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
