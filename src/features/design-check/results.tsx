import { roundUpLength_mm } from "../../../shared/physics/predict";
import { fromHertz } from "../../../shared/units";
import type { PredictionResult } from "../../api/predictions";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { StatusNote } from "../../components/ui/status-note";
import { fmt, lengthText, type DesignUnits } from "./design-model";

type LayerResult = PredictionResult["layers"][number];

/** S as people write it: 412, 3 230, 3.2 × 10⁶. */
export function formatFactor(S: number): string {
  if (S < 10_000) return S < 10 ? S.toFixed(2) : Math.round(S).toLocaleString("en-GB");
  const exp = Math.floor(Math.log10(S));
  const sup = String(exp).replace(/\d/g, (d) => "⁰¹²³⁴⁵⁶⁷⁸⁹"[Number(d)]);
  return `${(S / 10 ** exp).toFixed(1)} × 10${sup}`;
}

const tesla = (B: number) => (B >= 0.1 ? `${fmt(B, 3)} T` : B >= 1e-4 ? `${fmt(B * 1000, 3)} mT` : `${fmt(B * 1e6, 3)} µT`);
const gauss = (B: number) => (B >= 1e-4 ? `${fmt(B * 1e4, 3)} G` : `${fmt(B * 1e7, 3)} mG`);

/** A flux density (tesla) in the family of the unit the person chose for the field: gauss for G, mG and Oe, tesla otherwise. */
export function fluxText(B_T: number, fieldUnit: DesignUnits["field"]): string {
  return fieldUnit === "G" || fieldUnit === "mG" || fieldUnit === "Oe" ? gauss(B_T) : tesla(B_T);
}

/** A frequency in the person's unit: "60 Hz", "1.2 kHz"; DC for 0. */
export function frequencyText(hz: number, unit: DesignUnits["frequency"]): string {
  if (hz === 0) return "DC (static)";
  return `${fmt(fromHertz(hz, unit), 4)} ${unit}`;
}

/** The margin as a number and a word, so it reads without the bar's colour. */
export function marginWord(l: Pick<LayerResult, "saturation_T" | "saturationMargin">): { word: string; tone: "ok" | "caution" | "danger" | "info" } {
  if (l.saturation_T == null || l.saturationMargin == null) return { word: "does not saturate (non-magnetic)", tone: "info" };
  if (l.saturationMargin < 1) return { word: "saturated", tone: "danger" };
  if (l.saturationMargin < 3) return { word: "near saturation", tone: "caution" };
  return { word: "ample", tone: "ok" };
}

const db = (figure: { attenuation_db: number; beyondLimit: boolean }) => (figure.beyondLimit ? `over ${figure.attenuation_db.toFixed(0)} dB` : `${figure.attenuation_db.toFixed(1)} dB`);

/** Whether the shop's measured lots of this design's class set the figure and its band. */
function CalibrationLine({ calibration }: { calibration: NonNullable<PredictionResult["calibration"]> }) {
  const day = new Date(calibration.fittedAt).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
  return (
    <p className="text-meta text-flux-700" data-testid="calibration-source" data-source={calibration.source} data-fit-id={calibration.fitId}>
      {calibration.source === "shop"
        ? `Calibrated on ${calibration.lots} of the shop's measured lots (fitted ${day}); the range is how far such lots fell from predictions made without them.`
        : `Library values: the shop's ${calibration.lots} measured lots of this kind do not yet improve on them (checked ${day}).`}
    </p>
  );
}

/** The built figure as the headline with its likely range; the seamless shell beside it, smaller, and one sentence on the difference. */
export function Headline({ result, frequency, units }: { result: PredictionResult; frequency: number; units: DesignUnits }) {
  const { band, ideal, asBuilt } = result;
  return (
    <div className="space-y-3">
      <div className="grid items-end gap-x-8 gap-y-4 sm:grid-cols-2 lg:grid-cols-[auto_auto_1fr]">
        <div>
          <p className="text-meta text-flux-600">Attenuation at {frequencyText(frequency, units.frequency)}, as built</p>
          <p className="font-display text-h1 text-flux-950" data-testid="attenuation-db">
            {db(result)}
          </p>
          <p className="text-meta text-flux-700" data-testid="band">
            likely {band.low_db.toFixed(0)}–{band.high_db.toFixed(0)} dB
          </p>
          {result.calibration && <CalibrationLine calibration={result.calibration} />}
        </div>
        <div>
          <p className="text-meta text-flux-600">Shielding factor (outside ÷ inside)</p>
          <p className="font-display text-h3 text-flux-950" data-testid="shielding-factor">
            {formatFactor(result.shieldingFactor)}
          </p>
        </div>
        <div className="border-l-2 border-nickel-300 pl-4" data-testid="ideal">
          <p className="text-meta text-flux-600">Seamless shell (ideal)</p>
          <p className="font-display text-h4 text-flux-700" data-testid="ideal-db">
            {db(ideal)}
          </p>
        </div>
      </div>
      {result.warnings.some((w) => w.code === "SATURATED") && (
        <StatusNote tone="danger" word="Saturates">
          A wall saturates in this field, so the figures above do not hold: see the warnings below.
        </StatusNote>
      )}
      <p className="text-flux-800" data-testid="as-built-summary">
        {asBuilt.summary}
      </p>
      <p className="text-meta text-flux-600">
        The figures hold for a field {result.fieldDirection}. They are engineering estimates, not a guarantee: the measured values on the lot's certificate rule, and safety-critical uses need your own qualified review.
      </p>
    </div>
  );
}

const BAR_COLOURS = { ok: "bg-ok-700", caution: "bg-caution-700", danger: "bg-danger-700", info: "bg-flux-400" } as const;

/** Wall flux against saturation per layer, with the rule of thumb's third-to-half band marked. */
export function LayerBars({ result, materialName, units }: { result: PredictionResult; materialName: (id: string) => string; units: DesignUnits }) {
  const flux = (B: number) => fluxText(B, units.field);
  return (
    <ol className="space-y-4" aria-label="Layers: wall flux and saturation margin" data-testid="layer-bars">
      {result.layers.map((l) => {
        const { word, tone } = marginWord(l);
        const fraction = l.saturation_T ? Math.min(1, l.wallFluxDensity_T / l.saturation_T) : 0;
        const margin = l.saturationMargin == null ? "—" : l.saturationMargin > 1000 ? "over 1 000 ×" : `${fmt(l.saturationMargin, 3)} ×`;
        return (
          <li key={l.index} className="space-y-1.5">
            <div className="flex flex-wrap items-baseline justify-between gap-x-4">
              <span className="font-semibold text-flux-900">
                Layer {l.index + 1} · {l.material ? materialName(l.material) : "custom"} · {lengthText(l.thickness_mm, units.length)}
              </span>
              <span className="text-meta text-flux-700">
                margin <strong className="font-mono">{margin}</strong> · <strong>{word}</strong>
              </span>
            </div>
            {l.saturation_T != null && (
              <div className="relative h-4 rounded-sm bg-nickel-100 ring-1 ring-nickel-300" role="img" aria-label={`Wall flux ${flux(l.wallFluxDensity_T)} of ${flux(l.saturation_T)} saturation: ${word}`}>
                <div className={`h-full rounded-sm ${BAR_COLOURS[tone]}`} style={{ width: `max(3px, ${fraction * 100}%)` }} />
                {/* keep the wall at or below about a third to a half of saturation [practice] */}
                <div className="absolute inset-y-0 border-l-2 border-dashed border-flux-700" style={{ left: "33.3%" }} aria-hidden="true" />
                <div className="absolute inset-y-0 border-l-2 border-dashed border-flux-700" style={{ left: "50%" }} aria-hidden="true" />
              </div>
            )}
            <p className="text-meta text-flux-600">
              {l.skinDepth_mm != null ? "Peak wall flux (outer face) " : "Wall flux "}
              {flux(l.wallFluxDensity_T)}
              {l.saturation_T != null ? ` of ${flux(l.saturation_T)} saturation` : ""} · μr used {Math.round(l.mu_r).toLocaleString("en-GB")} (
              {l.muReason}
              {l.skinDepth_mm != null ? `) · skin depth ${lengthText(l.skinDepth_mm, units.length, 3)}` : ")"}
            </p>
          </li>
        );
      })}
      <li className="text-meta text-flux-600">Dashed marks: a third and a half of saturation; keep the wall flux left of them.</li>
    </ol>
  );
}

export function Warnings({ result }: { result: PredictionResult }) {
  if (result.warnings.length === 0) return <p className="text-flux-700">No design warnings for these values.</p>;
  return (
    <div className="space-y-2" data-testid="warnings">
      {result.warnings.map((w, i) => (
        <StatusNote key={`${w.code}-${i}`} tone={w.code === "SATURATED" ? "danger" : "caution"} word={w.code === "SATURATED" ? "Saturated" : "Check"}>
          {w.message}
        </StatusNote>
      ))}
    </div>
  );
}

/** Each cable hole: what its collar gives, what the design needs, in words as well as figures. */
export function HoleTable({ result, units }: { result: PredictionResult; units: DesignUnits }) {
  const lost = result.wallAttenuation_db - result.attenuation_db;
  const L = (mm: number) => lengthText(mm, units.length);
  type Hole = PredictionResult["holes"][number];
  return (
    <div className="space-y-2">
      <ResponsiveTable<Hole>
        caption="Cable holes: collar attenuation and the collar length the design needs"
        testId="hole-table"
        rowTestId="hole-row"
        rows={result.holes}
        rowKey={(h) => String(h.index)}
        columns={[
          { key: "hole", header: "Hole", primary: true, cell: (h) => `Hole ${h.index + 1}`, className: "font-semibold" },
          { key: "diameter", header: "Diameter", align: "end", className: "font-mono", cell: (h) => `Ø ${L(h.diameter_mm)}` },
          { key: "collar", header: "Collar", align: "end", className: "font-mono", cell: (h) => (h.collarLength_mm > 0 ? L(h.collarLength_mm) : "none") },
          { key: "gives", header: "Collar gives", align: "end", className: "font-mono", cell: (h) => `${h.collarAttenuation_db.toFixed(0)} dB` },
          { key: "needed", header: "Collar needed, at least", align: "end", className: "font-mono", cell: (h) => L(roundUpLength_mm(h.neededCollarLength_mm)) },
          {
            key: "verdict",
            header: "Verdict",
            cell: (h) => {
              const short = h.collarLength_mm < h.neededCollarLength_mm;
              return <span className={`font-semibold ${short ? "text-danger-700" : "text-ok-700"}`}>{short ? "too short" : "long enough"}</span>;
            },
          },
        ]}
      />
      <p className="text-meta text-flux-600" data-testid="hole-summary">
        {lost >= 0.05
          ? `The built walls alone give about ${result.wallAttenuation_db.toFixed(1)} dB; leakage through the holes takes that to ${result.attenuation_db.toFixed(1)} dB, the figure above.`
          : `The holes cost less than 0.1 dB here: the walls decide the figure above.`}{" "}
        Collar figures take the weak direction of the field; needed lengths aim at the built walls' figure. Estimates, like every figure here.
      </p>
    </div>
  );
}
