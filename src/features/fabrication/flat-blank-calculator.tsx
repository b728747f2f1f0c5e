import { useEffect, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router-dom";
import { PRESS_WORK_CAUTION, suggestKFactor } from "../../../shared/fabrication";
import type { BlankRequest } from "../../../shared/schemas/blank";
import { meQueryOptions } from "../../api/auth";
import { flatBlankPrefillKeys } from "../../config/paths";
import { ApiError } from "../../api/client";
import { blankQueryOptions, type BlankResponse } from "../../api/fabrication";
import { materialsQueryOptions } from "../../api/materials";
import { PanelBoundary } from "../../components/error-boundary";
import { SelectField, TextField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { fmtMm } from "../../components/drawing/drawing";
import { DxfDownloadButton } from "./dxf-download-button";
import { FlatPatternLegend, FlatPatternSvg } from "./flat-pattern-svg";
import { PriceEstimatePanel } from "./price-estimate-panel";
import { useDebounced } from "../../lib/use-debounced";

export type PartKind = "box-bent" | "cylinder-drawn" | "cylinder-rolled";

export interface BlankForm {
  kind: PartKind;
  width: string;
  depth: string;
  height: string;
  diameter: string;
  length: string;
  thickness: string;
  bendRadius: string;
  kFactor: string;
  cornerRadius: string;
  trim: string;
  seamOverlap: string;
  material: string;
}

type FieldName = Exclude<keyof BlankForm, "kind"> | "kind";

const initial: BlankForm = {
  kind: "box-bent", width: "80", depth: "60", height: "40", diameter: "50", length: "60", thickness: "1",
  bendRadius: "1.5", kFactor: "", cornerRadius: "3", trim: "0", seamOverlap: "6", material: "ni80",
};

const kinds: readonly PartKind[] = ["box-bent", "cylinder-drawn", "cylinder-rolled"];

/**
 * The inputs a link fills in (paths.flatBlank.href): known keys only, an unknown kind ignored,
 * material "none" for no material. The numbers stay text; the server checks them as if typed.
 */
export function formFromSearch(search: URLSearchParams, base: BlankForm = initial): BlankForm {
  const form = { ...base };
  for (const key of flatBlankPrefillKeys) {
    const value = search.get(key);
    if (value === null) continue;
    if (key === "kind") {
      if ((kinds as readonly string[]).includes(value)) form.kind = value as PartKind;
    } else form[key] = key === "material" && value === "none" ? "" : value;
  }
  return form;
}

/** Server field paths (also a price estimate's `configuration.` ones) → the form's fields. */
const serverFieldToForm: Record<string, FieldName> = {
  "dimensions_mm.width": "width", "dimensions_mm.depth": "depth", "dimensions_mm.height": "height",
  "dimensions_mm.diameter": "diameter", "dimensions_mm.length": "length", thickness_mm: "thickness",
  "layers.0.thickness_mm": "thickness", bendRadius_mm: "bendRadius", kFactor: "kFactor", cornerRadius_mm: "cornerRadius",
  trim_mm: "trim", seamOverlap_mm: "seamOverlap", material: "material", "layers.0.material": "material", method: "kind", shape: "kind",
};

export function formErrorsFrom(error: unknown): Partial<Record<FieldName, string>> {
  const out: Partial<Record<FieldName, string>> = {};
  if (!(error instanceof ApiError)) return out;
  for (const [path, message] of Object.entries(error.fields)) {
    const field = serverFieldToForm[path.replace(/^configuration\./, "")];
    if (field && !out[field]) out[field] = message;
  }
  return out;
}

// An empty box is sent as null, so the server's own message says what is missing.
const num = (s: string): number => (s.trim() === "" ? (null as unknown as number) : Number(s.replace(",", ".")));
const opt = (s: string): number | undefined => (s.trim() === "" ? undefined : Number(s.replace(",", ".")));

export function suggestedK(form: BlankForm): number | null {
  const r = opt(form.bendRadius);
  const t = opt(form.thickness);
  return r !== undefined && t !== undefined && r >= 0 && t > 0 ? +suggestKFactor(r, t).toFixed(3) : null;
}

export function toBlankRequest(form: BlankForm): BlankRequest {
  const material = form.material ? { material: form.material } : {};
  if (form.kind === "box-bent") {
    return {
      shape: "box", method: "bent",
      dimensions_mm: { width: num(form.width), depth: num(form.depth), height: num(form.height) },
      thickness_mm: num(form.thickness), bendRadius_mm: num(form.bendRadius),
      kFactor: opt(form.kFactor) ?? suggestedK(form) ?? (null as unknown as number), ...material,
    };
  }
  const dimensions_mm = { diameter: num(form.diameter), length: num(form.length) };
  if (form.kind === "cylinder-drawn") {
    return { shape: "cylinder", method: "drawn", dimensions_mm, thickness_mm: num(form.thickness), cornerRadius_mm: opt(form.cornerRadius), trim_mm: opt(form.trim), ...material };
  }
  return { shape: "cylinder", method: "rolled", dimensions_mm, thickness_mm: num(form.thickness), seamOverlap_mm: opt(form.seamOverlap), ...material };
}

function Figure({ label, value, testId }: { label: string; value: string; testId?: string }) {
  return (
    <div>
      <dt className="text-meta text-flux-600">{label}</dt>
      <dd className="font-mono text-lead text-flux-950" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

function BlankFigures({ result }: { result: BlankResponse }) {
  const b = result.blank;
  return (
    <dl className="grid gap-4 sm:grid-cols-3">
      {b.kind === "disc" ? (
        <Figure label="Blank: disc, diameter" value={`Ø ${fmtMm(b.diameter_mm)} mm`} testId="blank-size" />
      ) : (
        <Figure label={b.kind === "cross" ? "Blank: cross, overall" : "Wall blank (rolled round)"} value={`${fmtMm(b.length_mm)} × ${fmtMm(b.width_mm)} mm`} testId="blank-size" />
      )}
      <Figure label="Blank area" value={`${Math.round(result.area_mm2).toLocaleString("en-GB")} mm²`} />
      <Figure label={result.material ? `Mass in ${result.material.id}` : "Mass"} value={result.mass_kg !== undefined ? `${result.mass_kg.toFixed(3)} kg` : "choose a material"} />
      {result.method === "bent" && (
        <>
          <Figure label="Bend allowance per 90° bend" value={`${fmtMm(result.bendAllowance_mm, 3)} mm`} testId="bend-allowance" />
          <Figure label="Bend deduction" value={`${fmtMm(result.bendDeduction_mm, 3)} mm`} />
          <Figure label="K-factor used · bends" value={`${result.kFactor} · ${result.bendCount}`} />
        </>
      )}
      {result.method === "rolled" && (
        <>
          <Figure label="End discs" value={`2 × Ø ${fmtMm(result.endCaps[0].diameter_mm)} mm`} />
          <Figure label="Seam" value={result.seam === "lap" ? "lap joint" : "butt weld"} />
          <Figure label="Weld length" value={`${fmtMm(result.weldLength_mm, 1)} mm`} />
        </>
      )}
      {result.method === "drawn" && <Figure label="Overall draw ratio D/d" value={fmtMm(result.drawRatio, 3)} />}
    </dl>
  );
}

function DrawStages({ result }: { result: BlankResponse }) {
  if (result.method !== "drawn") return null;
  return (
    <div className="space-y-2">
      <h3 className="text-h4">Draw stages</h3>
      <table className="w-full text-left text-body">
        <thead className="border-b border-nickel-300 text-meta text-flux-600">
          <tr>
            <th className="py-1 pr-3 font-semibold">Stage</th>
            <th className="py-1 pr-3 font-semibold">Punch Ø</th>
            <th className="py-1 pr-3 font-semibold">Reduction</th>
            <th className="py-1 font-semibold">Then</th>
          </tr>
        </thead>
        <tbody className="font-mono">
          {result.drawStages.map((s) => (
            <tr key={s.stage} className="border-b border-nickel-100">
              <td className="py-1 pr-3">{s.stage === 1 ? "1 (first draw)" : `${s.stage} (redraw)`}</td>
              <td className="py-1 pr-3">{fmtMm(s.punchDiameter_mm)} mm</td>
              <td className="py-1 pr-3">{fmtMm(s.ratio, 3)}</td>
              <td className="py-1 font-sans">{s.annealAfter ? "process anneal" : "—"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-meta text-flux-700">
        {result.processAnneals === 0 ? "No process anneal needed between draws." : `${result.processAnneals} process anneal${result.processAnneals === 1 ? "" : "s"} between draws, before the final hydrogen anneal.`}
      </p>
    </div>
  );
}

/** The flat blank calculator: inputs on the left, live results, drawing and (signed in) price on the right. */
export function FlatBlankCalculator() {
  const [search] = useSearchParams();
  const [form, setForm] = useState<BlankForm>(() => formFromSearch(search));
  const [quantity, setQuantity] = useState("10");
  const me = useQuery(meQueryOptions);
  // the shop's library as the server has it now: a material the planner adds appears, a retired one goes
  const materials = useQuery(materialsQueryOptions);
  const library = materials.data ?? [];
  const chosenUnlisted = form.material !== "" && !library.some((m) => m.id === form.material);
  const request = useDebounced(toBlankRequest(form), 300);
  const blank = useQuery({ ...blankQueryOptions(request), retry: false });
  // keep the last good drawing while the inputs are being corrected
  const [lastGood, setLastGood] = useState<{ result: BlankResponse; request: BlankRequest } | null>(null);
  useEffect(() => {
    if (blank.isSuccess && !blank.isPlaceholderData) setLastGood({ result: blank.data, request });
  }, [blank.isSuccess, blank.isPlaceholderData, blank.data, request]);
  const errors = blank.isError ? formErrorsFrom(blank.error) : {};
  const strayError = blank.isError && Object.keys(errors).length === 0 ? (blank.error as Error).message : null;
  const shown = lastGood?.result;
  const stale = blank.isError || blank.isFetching;

  const set = (name: keyof BlankForm) => (e: { target: { value: string } }) => setForm((f) => ({ ...f, [name]: e.target.value }));
  const field = (name: Exclude<FieldName, "kind">, label: string, hint?: string) => (
    <TextField label={label} hint={hint} inputMode="decimal" name={name} value={form[name]} onChange={set(name)} error={errors[name]} autoComplete="off" />
  );
  const k = suggestedK(form);

  return (
    <div className="grid gap-6 lg:grid-cols-[22rem_1fr]">
      <Panel title="The part">
        <form className="space-y-4" onSubmit={(e) => e.preventDefault()} noValidate aria-label="Flat blank inputs">
          <SelectField label="Shape and method" name="kind" value={form.kind} onChange={set("kind")} error={errors.kind}>
            <option value="box-bent">Box, bent from a cross-shaped blank</option>
            <option value="cylinder-drawn">Cylinder (can), deep-drawn from a disc</option>
            <option value="cylinder-rolled">Cylinder (can), rolled and seam-welded</option>
          </SelectField>
          <fieldset className="space-y-4">
            <legend className="mb-2 text-meta font-semibold uppercase tracking-wide text-flux-600">Inside dimensions, mm</legend>
            {form.kind === "box-bent" ? (
              <>
                {field("width", "Width (mm)")}
                {field("depth", "Depth (mm)")}
                {field("height", "Height (mm)", "From the inside of the bottom to the top edge.")}
              </>
            ) : (
              <>
                {field("diameter", "Inside diameter (mm)")}
                {field("length", form.kind === "cylinder-drawn" ? "Inside height (mm)" : "Length (mm)")}
              </>
            )}
          </fieldset>
          {field("thickness", "Sheet thickness (mm)")}
          {form.kind === "box-bent" && (
            <>
              {field("bendRadius", "Inside bend radius (mm)")}
              {field("kFactor", "K-factor", k !== null ? `Leave empty for the typical ${k} at this radius and thickness; 0 to 0.5.` : "Between 0 and 0.5.")}
            </>
          )}
          {form.kind === "cylinder-drawn" && (
            <>
              {field("cornerRadius", "Inside corner radius (mm)", "At most half the diameter.")}
              {field("trim", "Trim allowance (mm)", "Added to the height and trimmed off after drawing.")}
            </>
          )}
          {form.kind === "cylinder-rolled" && field("seamOverlap", "Seam overlap (mm)", "0 for a butt weld; the overlap for a lap joint.")}
          <SelectField
            label="Material"
            name="material"
            value={form.material}
            onChange={set("material")}
            error={errors.material}
            hint={materials.isError ? "The material list could not be loaded; reload the page to try again. The blank itself needs no material." : "Gives the mass; drawn parts also use its forming limits."}
          >
            <option value="">None (no mass)</option>
            {/* a material named by a link stays selectable while the list loads; the server judges it */}
            {chosenUnlisted && <option value={form.material}>{materials.isPending ? `${form.material} (loading the list…)` : form.material}</option>}
            {library.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name}
              </option>
            ))}
          </SelectField>
          {me.data && (
            <TextField label="Quantity (for the price)" inputMode="numeric" name="quantity" value={quantity} onChange={(e) => setQuantity(e.target.value)} autoComplete="off" />
          )}
        </form>
      </Panel>

      <div className="space-y-6">
        <Panel
          title="Flat blank"
          actions={
            <span className="flex min-h-6 items-center gap-2 text-meta text-flux-600" aria-live="polite">
              {blank.isFetching && (
                <>
                  <Spinner /> Working it out…
                </>
              )}
            </span>
          }
        >
          <div className="space-y-5">
            {blank.isError && (
              <StatusNote tone="danger" word="Check the inputs">
                {strayError ?? "Some values cannot be made; see the messages beside the fields."}
                {shown ? " The figures below are from the last values that worked." : ""}
              </StatusNote>
            )}
            {!shown && blank.isPending && <p className="text-flux-600">Working out the blank…</p>}
            {shown && (
              <div className={stale ? "stale" : undefined} data-testid="blank-result" aria-busy={blank.isFetching || undefined}>
                <div className="space-y-5">
                  <BlankFigures result={shown} />
                  {shown.warnings.length > 0 && (
                    <div className="space-y-2">
                      {shown.warnings.map((w) => (
                        <StatusNote key={w.code} tone="caution">
                          {w.message}
                        </StatusNote>
                      ))}
                    </div>
                  )}
                  <DrawStages result={shown} />
                  <PanelBoundary name="the flat pattern drawing">
                    <div className="rounded-md border border-nickel-200 bg-white p-2">
                      <FlatPatternSvg result={shown} />
                    </div>
                    <FlatPatternLegend />
                  </PanelBoundary>
                  {lastGood && <DxfDownloadButton request={lastGood.request} disabled={blank.isError} />}
                </div>
              </div>
            )}
            <StatusNote tone="caution" word="Press work">
              {PRESS_WORK_CAUTION}
            </StatusNote>
          </div>
        </Panel>
        {me.data && lastGood && (
          <PanelBoundary name="the price breakdown">
            <PriceEstimatePanel request={lastGood.request} quantity={quantity} />
          </PanelBoundary>
        )}
      </div>
    </div>
  );
}
