import { useState, type FormEvent } from "react";
import type { DesignSearchUpdate } from "../../../shared/schemas/shop-rates";
import { DEFAULT_DESIGN_SEARCH_SETTINGS } from "../../../shared/schemas/pricing";
import { designSearchUpdateSchema } from "../../../shared/schemas/shop-rates";
import { ApiError } from "../../api/client";
import { useSaveShopRates, type ShopRates } from "../../api/fabrication";
import { Button } from "../../components/ui/button";
import { TextField } from "../../components/ui/field";
import { SaveBar, type SaveMessage } from "./form-bits";

const listText = (xs: readonly number[]) => xs.join(", ");

/** "5, 10; 15 20" → [5, 10, 15, 20]; a word that is no number stays NaN so the schema names it. */
export function parseMillimetreList(text: string): number[] {
  return text
    .split(/[\s,;]+/)
    .filter(Boolean)
    .map((s) => Number(s.replace(",", ".")));
}

/** What the design advisor searches with: the gap steps between nested layers, the gauges it offers, and the saturation margin it recommends with. */
export function DesignSearchForm({ current }: { current: ShopRates }) {
  const save = useSaveShopRates();
  const [gaps, setGaps] = useState(listText(current.designSearch.gapSteps_mm));
  const [gauges, setGauges] = useState(listText(current.designSearch.gauges_mm));
  const [margin, setMargin] = useState(String(current.designSearch.minSaturationMargin));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<SaveMessage>(null);
  const [asking, setAsking] = useState<DesignSearchUpdate | null>(null);

  // checked first; then the second step names the version
  const ask = (e: FormEvent) => {
    e.preventDefault();
    setMessage(null);
    const parsed = designSearchUpdateSchema.safeParse({
      designSearch: { gapSteps_mm: parseMillimetreList(gaps), gauges_mm: parseMillimetreList(gauges), minSaturationMargin: margin.trim() === "" ? NaN : Number(margin) },
    });
    if (!parsed.success) {
      setErrors(fieldsOf(parsed.error.issues.map((i) => [i.path.join("."), i.message])));
      setMessage({ tone: "danger", text: "Some values need attention; see the messages beside them." });
      return;
    }
    setErrors({});
    setAsking(parsed.data);
  };
  const fieldsOf = (pairs: [string, string][]) =>
    Object.fromEntries(pairs.map(([path, text]) => [path.startsWith("designSearch.gapSteps_mm") ? "gaps" : path.startsWith("designSearch.gauges_mm") ? "gauges" : "margin", text]));
  const confirm = async () => {
    if (!asking) return;
    try {
      const saved = await save.mutateAsync({ part: "design-search", body: asking });
      setGaps(listText(saved.designSearch.gapSteps_mm));
      setGauges(listText(saved.designSearch.gauges_mm));
      setMessage({ tone: "ok", text: `Saved as version ${saved.version}. The design advisor searches with it from now on.` });
    } catch (error) {
      if (error instanceof ApiError && Object.keys(error.fields).length) setErrors(fieldsOf(Object.entries(error.fields)));
      setMessage({ tone: "danger", text: error instanceof ApiError ? error.message : "Something went wrong. Try again." });
    } finally {
      setAsking(null);
    }
  };

  return (
      <form onSubmit={ask} noValidate className="space-y-4" aria-label="Design advisor settings">
        <p className="text-meta text-flux-600">
          The advisor tries every nest of the alloys in stock at these gauges (unless the customer names other stocked ones), with these gaps between neighbouring layers, and
          recommends only designs whose every wall stays at or below the given share of its saturation. Each gauge and gap step adds to the designs a search tries.
        </p>
        <div className="grid gap-3 sm:grid-cols-3">
          <TextField label="Gap steps (mm)" hint="Separate them with commas, e.g. 5, 10, 15, 20." value={gaps} onChange={(e) => setGaps(e.target.value)} error={errors.gaps} inputMode="decimal" />
          <TextField label="Gauges offered (mm)" hint="Of those in stock, e.g. 0.5, 1, 1.5, 2." value={gauges} onChange={(e) => setGauges(e.target.value)} error={errors.gauges} inputMode="decimal" />
          <TextField
            label="Saturation margin (saturation ÷ peak wall flux)"
            hint="3 keeps every wall at or below a third of its saturation."
            type="number"
            step="any"
            inputMode="decimal"
            value={margin}
            onChange={(e) => setMargin(e.target.value)}
            error={errors.margin}
          />
        </div>
        <SaveBar
          what="advisor settings"
          nextVersion={current.version + 1}
          asking={asking !== null}
          pending={save.isPending}
          message={message}
          onConfirm={() => void confirm()}
          onCancel={() => setAsking(null)}
          extra={
          <Button
            variant="quiet"
            onClick={() => {
              setGaps(listText(DEFAULT_DESIGN_SEARCH_SETTINGS.gapSteps_mm));
              setGauges(listText(DEFAULT_DESIGN_SEARCH_SETTINGS.gauges_mm));
              setMargin(String(DEFAULT_DESIGN_SEARCH_SETTINGS.minSaturationMargin));
            }}
          >
            Back to the defaults
          </Button>
          }
        />
      </form>
  );
}
