import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { PRESS_WORK_CAUTION } from "../../../shared/fabrication";
import type { BlankRequest } from "../../../shared/schemas/blank";
import { meQueryOptions } from "../../api/auth";
import { ApiError, blamesInputs } from "../../api/client";
import { blankQueryOptions, type BlankResponse } from "../../api/fabrication";
import { materialsQueryOptions } from "../../api/materials";
import { PanelBoundary } from "../../components/error-boundary";
import { ServerTrouble } from "../../components/server-trouble";
import { SelectField } from "../../components/ui/field";
import { Panel } from "../../components/ui/panel";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { plainScale, quantityScale, UnitInput } from "../../components/ui/unit-input";
import { useDebounced } from "../../lib/use-debounced";
import { useSearchState, type EditKind } from "../../lib/use-search-state";
import { blankFromParams, blankLengthUnits, blankToParams, quantityProblem, suggestedK, toBlankRequest, type BlankForm, type BlankLengthUnit, type Kept, type PartKind } from "./blank-form";
import { DxfDownloadButton } from "./dxf-download-button";
import { FlatPatternLegend, FlatPatternSvg } from "./flat-pattern-svg";
import { PriceEstimatePanel } from "./price-estimate-panel";
import { fromMillimetres, unitSymbols } from "../../../shared/units";

type FieldName = keyof BlankForm;

/** Server field paths (also a price estimate's `configuration.` ones) → the form's fields. */
const serverFieldToForm: Record<string, FieldName> = {
  "dimensions_mm.width": "width_mm", "dimensions_mm.depth": "depth_mm", "dimensions_mm.height": "height_mm",
  "dimensions_mm.diameter": "diameter_mm", "dimensions_mm.length": "length_mm", thickness_mm: "thickness_mm",
  "layers.0.thickness_mm": "thickness_mm", bendRadius_mm: "bendRadius_mm", kFactor: "kFactor", cornerRadius_mm: "cornerRadius_mm",
  trim_mm: "trim_mm", seamOverlap_mm: "seamOverlap_mm", material: "material", "layers.0.material": "material", method: "kind", shape: "kind",
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

function BlankFigures({ result, unit }: { result: BlankResponse; unit: BlankLengthUnit }) {
  const n = (mm: number, digits = 2) => (unit === "mm" ? String(+mm.toFixed(digits)) : String(+fromMillimetres(mm, unit).toFixed(digits + 2)));
  const L = (mm: number, digits = 2) => `${n(mm, digits)} ${unitSymbols[unit]}`;
  const size = (a: number, b: number) => `${n(a)} × ${n(b)} ${unitSymbols[unit]}`;
  const b = result.blank;
  return (
    <dl className="grid gap-4 sm:grid-cols-3">
      {b.kind === "disc" ? (
        <Figure label="Blank: disc, diameter" value={`Ø ${L(b.diameter_mm)}`} testId="blank-size" />
      ) : (
        <Figure label={b.kind === "cross" ? "Blank: cross, overall" : "Wall blank (rolled round)"} value={size(b.length_mm, b.width_mm)} testId="blank-size" />
      )}
      <Figure label="Blank area" value={unit === "mm" ? `${Math.round(result.area_mm2).toLocaleString("en-GB")} mm²` : `${+fromMillimetres(fromMillimetres(result.area_mm2, unit), unit).toFixed(2)} ${unitSymbols[unit]}²`} />
      <Figure label={result.material ? `Mass in ${result.material.id}` : "Mass"} value={result.mass_kg !== undefined ? `${result.mass_kg.toFixed(3)} kg` : "choose a material"} />
      {result.method === "bent" && (
        <>
          <Figure label="Bend allowance per 90° bend" value={L(result.bendAllowance_mm, 3)} testId="bend-allowance" />
          <Figure label="Bend deduction" value={L(result.bendDeduction_mm, 3)} />
          <Figure label="K-factor used · bends" value={`${result.kFactor} · ${result.bendCount}`} />
        </>
      )}
      {result.method === "rolled" && (
        <>
          <Figure label="End discs" value={`2 × Ø ${L(result.endCaps[0].diameter_mm)}`} />
          <Figure label="Seam" value={result.seam === "lap" ? "lap joint" : "butt weld"} />
          <Figure label="Weld length" value={L(result.weldLength_mm, 1)} />
        </>
      )}
      {result.method === "drawn" && <Figure label="Overall draw ratio D/d" value={String(+result.drawRatio.toFixed(3))} />}
    </dl>
  );
}

function DrawStages({ result, unit }: { result: BlankResponse; unit: BlankLengthUnit }) {
  if (result.method !== "drawn") return null;
  const L = (mm: number) => (unit === "mm" ? `${+mm.toFixed(2)} mm` : `${+fromMillimetres(mm, unit).toFixed(4)} ${unitSymbols[unit]}`);
  type Stage = (typeof result.drawStages)[number];
  return (
    <div className="space-y-2">
      <h3 className="text-h4">Draw stages</h3>
      <ResponsiveTable<Stage>
        caption="Draw stages: punch diameter, reduction and what follows each"
        rows={result.drawStages}
        rowKey={(s) => String(s.stage)}
        cardsBelow={420}
        columns={[
          { key: "stage", header: "Stage", primary: true, cell: (s) => (s.stage === 1 ? "1 (first draw)" : `${s.stage} (redraw)`) },
          { key: "punch", header: "Punch Ø", className: "font-mono", cell: (s) => L(s.punchDiameter_mm) },
          { key: "ratio", header: "Reduction", className: "font-mono", cell: (s) => String(+s.ratio.toFixed(3)) },
          { key: "then", header: "Then", cell: (s) => (s.annealAfter ? "process anneal" : "—") },
        ]}
      />
      <p className="text-meta text-flux-700">
        {result.processAnneals === 0 ? "No process anneal needed between draws." : `${result.processAnneals} process anneal${result.processAnneals === 1 ? "" : "s"} between draws, before the final hydrogen anneal.`}
      </p>
    </div>
  );
}

const readForm = (p: URLSearchParams) => blankFromParams(p);
const writeForm = (f: BlankForm) => blankToParams(f);

/** The flat blank calculator: inputs on the left, live results, drawing and (signed in) price on the right; the part lives in the address bar. */
export function FlatBlankCalculator() {
  const [form, setForm, commit] = useSearchState(readForm, writeForm);
  const me = useQuery(meQueryOptions);
  // the shop's library as the server has it now: a material the planner adds appears, a retired one goes
  const materials = useQuery(materialsQueryOptions);
  const library = materials.data ?? [];
  const chosenUnlisted = form.material !== "" && !library.some((m) => m.id === form.material);
  const request = useDebounced(toBlankRequest(form), 300);
  const blank = useQuery({ ...blankQueryOptions(request), retry: false });
  // keep the last good drawing while the inputs are being corrected or the server is not answering
  const [lastGood, setLastGood] = useState<{ result: BlankResponse; request: BlankRequest } | null>(null);
  if (blank.isSuccess && !blank.isPlaceholderData && lastGood?.result !== blank.data) setLastGood({ result: blank.data, request });
  const inputProblem = blank.isError && blamesInputs(blank.error);
  const errors = inputProblem ? formErrorsFrom(blank.error) : {};
  const strayError = inputProblem && Object.keys(errors).length === 0 ? (blank.error as Error).message : null;
  const shown = lastGood?.result;
  const stale = blank.isError || blank.isFetching;

  const set = <K extends FieldName>(name: K, value: BlankForm[K], kind: EditKind = "commit") => setForm({ ...form, [name]: value }, kind);
  const lengthScale = quantityScale("length", form.unit);
  const length = (name: Extract<FieldName, `${string}_mm`>, label: string, hint?: string) => (
    <UnitInput label={label} hint={hint} name={name.replace(/_mm$/, "")} scale={lengthScale} value={form[name] as Kept} onValueChange={(v) => set(name, v, "typing")} onCommit={commit} error={errors[name]} />
  );
  const k = suggestedK(form);
  const quantityError = quantityProblem(form.quantity);

  return (
    <div className="grid items-start gap-6 lg:grid-cols-[22rem_minmax(0,1fr)]">
      <Panel title="The part" className="min-w-0">
        <form className="space-y-4" onSubmit={(e) => e.preventDefault()} noValidate aria-label="Flat blank inputs">
          <SelectField label="Shape and method" name="kind" value={form.kind} onChange={(e) => set("kind", e.target.value as PartKind)} error={errors.kind}>
            <option value="box-bent">Box, bent from a cross-shaped blank</option>
            <option value="cylinder-drawn">Cylinder (can), deep-drawn from a disc</option>
            <option value="cylinder-rolled">Cylinder (can), rolled and seam-welded</option>
          </SelectField>
          <SelectField label="Lengths in" name="unit" hint="Shows every length in this unit; the part stays exactly as it is." value={form.unit} onChange={(e) => set("unit", e.target.value as BlankLengthUnit)}>
            {blankLengthUnits.map((u) => (
              <option key={u} value={u}>
                {u === "mm" ? "mm" : "inches"}
              </option>
            ))}
          </SelectField>
          <fieldset className="space-y-4">
            <legend className="mb-2 text-meta font-semibold uppercase tracking-wide text-flux-600">Inside dimensions</legend>
            {form.kind === "box-bent" ? (
              <>
                {length("width_mm", "Width")}
                {length("depth_mm", "Depth")}
                {length("height_mm", "Height", "From the inside of the bottom to the top edge.")}
              </>
            ) : (
              <>
                {length("diameter_mm", "Inside diameter")}
                {length("length_mm", form.kind === "cylinder-drawn" ? "Inside height" : "Length")}
              </>
            )}
          </fieldset>
          {length("thickness_mm", "Sheet thickness")}
          {form.kind === "box-bent" && (
            <>
              {length("bendRadius_mm", "Inside bend radius")}
              <UnitInput
                label="K-factor"
                name="kFactor"
                scale={plainScale}
                value={form.kFactor}
                onValueChange={(v) => set("kFactor", v, "typing")}
                onCommit={commit}
                error={errors.kFactor}
                hint={k !== null ? `Leave empty for the typical ${k} at this radius and thickness; 0 to 0.5.` : "Between 0 and 0.5."}
              />
            </>
          )}
          {form.kind === "cylinder-drawn" && (
            <>
              {length("cornerRadius_mm", "Inside corner radius", "At most half the diameter.")}
              {length("trim_mm", "Trim allowance", "Added to the height and trimmed off after drawing.")}
            </>
          )}
          {form.kind === "cylinder-rolled" && length("seamOverlap_mm", "Seam overlap", "0 for a butt weld; the overlap for a lap joint.")}
          <SelectField
            label="Material"
            name="material"
            value={form.material}
            onChange={(e) => set("material", e.target.value)}
            error={errors.material}
            hint={materials.isError ? "The material list could not be loaded; reload the page to try again. The blank itself needs no material." : "Gives the mass and checks the shop's stock sheets; drawn parts also use its forming limits."}
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
            <UnitInput label="Quantity (for the price)" name="quantity" inputMode="numeric" scale={plainScale} value={form.quantity} onValueChange={(v) => set("quantity", v, "typing")} onCommit={commit} error={quantityError ?? undefined} />
          )}
        </form>
      </Panel>

      <div className="min-w-0 space-y-6">
        <Panel
          title="Flat blank"
          actions={
            <span className="flex min-h-6 items-center gap-2 text-meta text-flux-600">
              {blank.isFetching && (
                <>
                  <Spinner /> Working it out…
                </>
              )}
            </span>
          }
        >
          <div className="space-y-5">
            {inputProblem && (
              <StatusNote tone="danger" word="Check the inputs">
                {strayError ?? "Some values cannot be made; see the messages beside the fields."}
                {shown ? " The figures below are from the last values that worked." : ""}
              </StatusNote>
            )}
            {blank.isError && !inputProblem && <ServerTrouble error={blank.error} what="the blank" kept={Boolean(shown)} onRetry={() => void blank.refetch()} />}
            {!shown && blank.isPending && <p className="text-flux-600">Working out the blank…</p>}
            {shown && (
              <div className={stale ? "stale" : undefined} data-testid="blank-result" aria-busy={blank.isFetching || undefined}>
                <div className="space-y-5">
                  <BlankFigures result={shown} unit={form.unit} />
                  {shown.warnings.length > 0 && (
                    <div className="space-y-2" data-testid="blank-warnings">
                      {shown.warnings.map((w, i) => (
                        <StatusNote key={`${w.code}-${i}`} tone="caution" word={w.code === "LARGER_THAN_STOCK" ? "Larger than stock" : w.code === "BEYOND_FORMING_LIMIT" || w.code === "DRAW_STAGES_EXCESSIVE" ? "Beyond forming limits" : w.code === "GAUGE_NOT_STOCKED" ? "Not stocked" : "Check"}>
                          {w.message}
                        </StatusNote>
                      ))}
                    </div>
                  )}
                  <DrawStages result={shown} unit={form.unit} />
                  <PanelBoundary name="the flat pattern drawing">
                    <div className="rounded-md border border-nickel-200 bg-white p-2">
                      <FlatPatternSvg result={shown} unit={form.unit} />
                    </div>
                    <FlatPatternLegend geometry={shown.geometry} />
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
            <PriceEstimatePanel request={lastGood.request} quantity={quantityError ? null : form.quantity} />
          </PanelBoundary>
        )}
      </div>
    </div>
  );
}
