import type { ReactNode } from "react";
import { MAX_ADVICE_LAYERS } from "../../../shared/schemas/design-advice";
import { fieldUnitLabels, frequencyUnitLabels, lengthUnitLabels } from "../../../shared/units";
import type { MaterialSummary } from "../../api/materials";
import { Button } from "../../components/ui/button";
import { ElapsedClock } from "./elapsed-clock";
import { Disclosure } from "../../components/ui/disclosure";
import { SelectField } from "../../components/ui/field";
import { fixedUnitScale, plainScale, quantityScale, UnitInput } from "../../components/ui/unit-input";
import {
  adviceFieldUnits, adviceFrequencyUnits, adviceLengthUnits, canMethods, dimensionsOf,
  type AdviceShape, type CanMethod, type DimensionKey, type Kept, type RequirementDraft, type RequirementErrors,
} from "./requirement-model";

interface Props {
  draft: RequirementDraft;
  onChange: (next: RequirementDraft) => void;
  errors: RequirementErrors;
  materials: MaterialSummary[];
  materialsError: boolean;
  onSearch: () => void;
  /** a search is running: the button says so and a stop is offered */
  searching: boolean;
  onStop: () => void;
}

const dbScale = fixedUnitScale("dB", "decibels");
const kgScale = fixedUnitScale("kg", "kilograms");
const dimensionWords: Record<DimensionKey, string> = { diameter: "diameter", length: "length", width: "width", depth: "depth", height: "height" };
const methodWords: Record<CanMethod, string> = { drawn: "Deep-drawn, seamless", rolled: "Rolled and seam-welded" };

/** Alloys a shield is made of: magnetic, with a saturation to check. */
export const shieldAlloys = (materials: MaterialSummary[]) => materials.filter((m) => m.saturation_T !== null && m.relativePermeability.initial > 1);

/** Any limit set: the limits group opens by itself, so what narrows the search is in view. */
export const hasLimits = (d: RequirementDraft) =>
  d.materials.length > 0 || d.methods.length > 0 || d.maxMass_kg !== null || dimensionsOf[d.shape].some((k) => d.outside[k] !== null);

const LIMIT_FIELDS = ["maxLayers", "materials", "methods", "maxMass_kg", "constraints", "outside."];

/** What the customer needs (the space, the field, the attenuation) and what bounds the answer. */
export function RequirementForm({ draft, onChange, errors, materials, materialsError, onSearch, searching, onStop }: Props) {
  const set = <K extends keyof RequirementDraft>(key: K, value: RequirementDraft[K]) => onChange({ ...draft, [key]: value });
  const lengthScale = quantityScale("length", draft.units.length);
  const keys = dimensionsOf[draft.shape];
  const alloys = shieldAlloys(materials);
  const limitProblem = Object.keys(errors).some((k) => LIMIT_FIELDS.some((f) => k.startsWith(f)));
  const toggle = <T extends string>(list: T[], item: T, on: boolean) => (on ? [...list, item] : list.filter((x) => x !== item));

  return (
    <form
      className="space-y-6"
      noValidate
      aria-label="Requirement"
      onSubmit={(e) => {
        e.preventDefault();
        onSearch();
      }}
    >
      <Section title="The space to protect">
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField label="Shape" name="shape" value={draft.shape} error={errors.shape} onChange={(e) => set("shape", e.target.value as AdviceShape)}>
            <option value="cylinder">Cylinder (can)</option>
            <option value="box">Box</option>
          </SelectField>
          <SelectField label="Lengths in" name="lengthUnit" value={draft.units.length} onChange={(e) => set("units", { ...draft.units, length: e.target.value as RequirementDraft["units"]["length"] })}>
            {adviceLengthUnits.map((u) => (
              <option key={u} value={u}>
                {u === "in" ? "inches" : lengthUnitLabels[u]}
              </option>
            ))}
          </SelectField>
          {keys.map((k) => (
            <UnitInput
              key={k}
              label={`Inside ${dimensionWords[k]}`}
              name={`inside.${k}`}
              scale={lengthScale}
              value={draft.inside[k]}
              error={errors[`inside.${k}`]}
              onValueChange={(v) => set("inside", { ...draft.inside, [k]: v })}
            />
          ))}
        </div>
        <p className="text-meta text-flux-600">The clear space inside the innermost layer: what you need to fit in.</p>
      </Section>

      <Section title="The field and the attenuation needed">
        {/* one column in the laptop's side panel: the hints need the width */}
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-1">
          <UnitInput
            label="Required attenuation"
            name="requiredAttenuation_db"
            scale={dbScale}
            value={draft.requiredAttenuation_db}
            error={errors.requiredAttenuation_db}
            hint="Field outside ÷ field inside, in decibels (20 dB = 10×)."
            onValueChange={(v) => set("requiredAttenuation_db", v)}
          />
          <UnitInput
            label="Frequency"
            name="frequency_hz"
            scale={quantityScale("frequency", draft.units.frequency)}
            value={draft.frequency_hz}
            error={errors.frequency_hz}
            hint="0 for a static field."
            unitSelect={{
              value: draft.units.frequency,
              options: adviceFrequencyUnits.map((u) => ({ value: u, label: frequencyUnitLabels[u] })),
              onChange: (u) => set("units", { ...draft.units, frequency: u as RequirementDraft["units"]["frequency"] }),
            }}
            onValueChange={(v) => set("frequency_hz", v)}
          />
          <UnitInput
            label="Field amplitude"
            name="amplitude_uT"
            scale={quantityScale("flux", draft.units.field)}
            value={draft.amplitude_uT}
            error={errors.amplitude_uT}
            hint="Peak flux density of the field outside the shield."
            unitSelect={{
              value: draft.units.field,
              options: adviceFieldUnits.map((u) => ({ value: u, label: fieldUnitLabels[u] })),
              onChange: (u) => set("units", { ...draft.units, field: u as RequirementDraft["units"]["field"] }),
            }}
            onValueChange={(v) => set("amplitude_uT", v)}
          />
          {draft.shape === "cylinder" ? (
            <SelectField label="Field direction" name="orientation" value={draft.orientation} error={errors.orientation} onChange={(e) => set("orientation", e.target.value as RequirementDraft["orientation"])}>
              <option value="transverse">Across the axis</option>
              <option value="axial">Along the axis</option>
            </SelectField>
          ) : (
            <p className="self-end text-meta text-flux-600">A box is figured with the field across it.</p>
          )}
          <UnitInput
            label="Quantity"
            name="quantity"
            inputMode="numeric"
            scale={plainScale}
            value={draft.quantity}
            error={errors.quantity}
            hint="Shields on the order: it sets the unit price."
            onValueChange={(v) => set("quantity", v)}
          />
        </div>
      </Section>

      <Disclosure
        key={limitProblem ? "limits-problem" : "limits"}
        title="Limits"
        digest={hasLimits(draft) ? "some set" : `up to ${draft.maxLayers} layers, any alloy`}
        defaultOpen={limitProblem || hasLimits(draft)}
        testId="limits"
      >
        <div className="space-y-5">
          {errors.constraints && <p className="font-semibold text-danger-700" data-testid="limits-error">{errors.constraints}</p>}
          <SelectField label="Most layers" name="maxLayers" value={String(draft.maxLayers)} error={errors.maxLayers} onChange={(e) => set("maxLayers", Number(e.target.value))}>
            {Array.from({ length: MAX_ADVICE_LAYERS }, (_, i) => i + 1).map((n) => (
              <option key={n} value={n}>
                {n}
              </option>
            ))}
          </SelectField>
          <Choices legend="Alloys" hint="None ticked: every alloy the shop stocks." error={errors.materials}>
            {materialsError && <p className="text-meta text-danger-700">The alloy list could not be loaded; the search uses every alloy the shop stocks.</p>}
            {alloys.map((m) => (
              <Check key={m.id} label={`${m.name} (${m.id})`} checked={draft.materials.includes(m.id)} onChange={(on) => set("materials", toggle(draft.materials, m.id, on).sort())} />
            ))}
          </Choices>
          {draft.shape === "cylinder" && (
            <Choices legend="How it may be made" hint="None ticked: either." error={errors.methods}>
              {canMethods.map((m) => (
                <Check key={m} label={methodWords[m]} checked={draft.methods.includes(m)} onChange={(on) => set("methods", canMethods.filter((x) => (x === m ? on : draft.methods.includes(x))))} />
              ))}
            </Choices>
          )}
          <div className="grid gap-4 sm:grid-cols-2">
            {keys.map((k) => (
              <UnitInput
                key={k}
                label={`Largest outside ${dimensionWords[k]}`}
                name={`outside.${k}`}
                scale={lengthScale}
                value={draft.outside[k]}
                error={errors[`outside.${k}`]}
                hint="Empty: no limit."
                onValueChange={(v: Kept) => set("outside", { ...draft.outside, [k]: v })}
              />
            ))}
            <UnitInput label="Largest mass" name="maxMass_kg" scale={kgScale} value={draft.maxMass_kg} error={errors.maxMass_kg} hint="Every layer, lid included. Empty: no limit." onValueChange={(v) => set("maxMass_kg", v)} />
          </div>
        </div>
      </Disclosure>

      {Object.keys(errors).length > 0 && (
        <p role="alert" className="font-semibold text-danger-700" data-testid="form-problem">
          {errors.constraints ?? "Not searched: see the messages beside the fields."}
        </p>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" pending={searching} pendingLabel="Searching…">
          Search designs
        </Button>
        {searching && (
          <>
            <Button variant="secondary" onClick={onStop}>
              Stop the search
            </Button>
            <ElapsedClock className="font-mono tabular text-meta text-flux-700" />
          </>
        )}
      </div>
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

function Choices({ legend, hint, error, children }: { legend: string; hint: string; error?: string; children: ReactNode }) {
  return (
    <fieldset className="space-y-2">
      <legend className="font-semibold text-flux-900">{legend}</legend>
      <p className="text-meta text-flux-600">{hint}</p>
      <div className="flex flex-wrap gap-x-5 gap-y-1">{children}</div>
      {error && <p className="text-meta font-semibold text-danger-700">{error}</p>}
    </fieldset>
  );
}

function Check({ label, checked, onChange }: { label: string; checked: boolean; onChange: (on: boolean) => void }) {
  return (
    <label className="flex min-h-touch items-center gap-2">
      <input type="checkbox" className="size-5 accent-anneal-600" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      {label}
    </label>
  );
}
