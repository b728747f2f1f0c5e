import { roundUpLength_mm } from "../../../shared/physics/predict";
import type { PredictionResult } from "../../api/predictions";
import { StatusNote } from "../../components/ui/status-note";
import { fmt } from "./design-model";
import { ScrollX } from "../../components/ui/scroll-x";

type LayerResult = PredictionResult["layers"][number];

/** S as people write it: 412, 3 230, 3.2 × 10⁶. */
export function formatFactor(S: number): string {
  if (S < 10_000) return S < 10 ? S.toFixed(2) : Math.round(S).toLocaleString("en-GB");
  const exp = Math.floor(Math.log10(S));
  const sup = String(exp).replace(/\d/g, (d) => "⁰¹²³⁴⁵⁶⁷⁸⁹"[Number(d)]);
  return `${(S / 10 ** exp).toFixed(1)} × 10${sup}`;
}

const tesla = (B: number) => (B >= 0.1 ? `${fmt(B, 3)} T` : B >= 1e-4 ? `${fmt(B * 1000, 3)} mT` : `${fmt(B * 1e6, 3)} µT`);

/** The margin as a number and a word, so it reads without the bar's colour. */
export function marginWord(l: Pick<LayerResult, "saturation_T" | "saturationMargin">): { word: string; tone: "ok" | "caution" | "danger" | "info" } {
  if (l.saturation_T == null || l.saturationMargin == null) return { word: "does not saturate (non-magnetic)", tone: "info" };
  if (l.saturationMargin < 1) return { word: "saturated", tone: "danger" };
  if (l.saturationMargin < 3) return { word: "near saturation", tone: "caution" };
  return { word: "ample", tone: "ok" };
}

export function Headline({ result, frequency }: { result: PredictionResult; frequency: number }) {
  const { band } = result;
  return (
    <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3" aria-live="polite">
      <div>
        <p className="text-meta text-flux-600">Attenuation at {frequency === 0 ? "DC (static)" : `${fmt(frequency, 4)} Hz`}</p>
        <p className="font-display text-h1 text-flux-950" data-testid="attenuation-db">
          {result.attenuation_db.toFixed(1)} dB
        </p>
      </div>
      <div>
        <p className="text-meta text-flux-600">Shielding factor (outside ÷ inside)</p>
        <p className="font-display text-h2 text-flux-950" data-testid="shielding-factor">
          {formatFactor(result.shieldingFactor)}
        </p>
      </div>
      <div>
        <p className="text-meta text-flux-600">Likely range once built</p>
        <p className="font-display text-h3 text-flux-900" data-testid="band">
          {band.low_db.toFixed(0)}–{band.high_db.toFixed(0)} dB
        </p>
        <p className="text-meta text-flux-600">Real shields fall short of the formulas (seams, lids, handling).</p>
      </div>
    </div>
  );
}

const BAR_COLOURS = { ok: "bg-ok-700", caution: "bg-caution-700", danger: "bg-danger-700", info: "bg-flux-400" } as const;

/** Wall flux against saturation per layer, with the rule of thumb's third-to-half band marked. */
export function LayerBars({ result, materialName }: { result: PredictionResult; materialName: (id: string) => string }) {
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
                Layer {l.index + 1} · {l.material ? materialName(l.material) : "custom"} · {fmt(l.thickness_mm)} mm
              </span>
              <span className="text-meta text-flux-700">
                margin <strong className="font-mono">{margin}</strong> · <strong>{word}</strong>
              </span>
            </div>
            {l.saturation_T != null && (
              <div className="relative h-4 rounded-sm bg-nickel-100 ring-1 ring-nickel-300" role="img" aria-label={`Wall flux ${tesla(l.wallFluxDensity_T)} of ${l.saturation_T} T saturation: ${word}`}>
                <div className={`h-full rounded-sm ${BAR_COLOURS[tone]}`} style={{ width: `max(3px, ${fraction * 100}%)` }} />
                {/* keep the wall at or below about a third to a half of saturation [practice] */}
                <div className="absolute inset-y-0 border-l-2 border-dashed border-flux-700" style={{ left: "33.3%" }} aria-hidden="true" />
                <div className="absolute inset-y-0 border-l-2 border-dashed border-flux-700" style={{ left: "50%" }} aria-hidden="true" />
              </div>
            )}
            <p className="text-meta text-flux-600">
              Wall flux {tesla(l.wallFluxDensity_T)}
              {l.saturation_T != null ? ` of ${l.saturation_T} T saturation` : ""} · μr used {Math.round(l.mu_r).toLocaleString("en-GB")} (
              {l.muSource === "explicit" ? "as you gave it" : "from the alloy's μ(B) curve at this flux"}
              {l.skinDepth_mm != null ? `) · skin depth ${fmt(l.skinDepth_mm, 3)} mm` : ")"}
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
export function HoleTable({ result }: { result: PredictionResult }) {
  const lost = result.wallAttenuation_db - result.attenuation_db;
  return (
    <div className="space-y-2">
      <ScrollX label="the cable holes table">
        <table className="w-full min-w-[30rem] text-left text-body" data-testid="hole-table">
          <caption className="sr-only">Cable holes: collar attenuation and the collar length the design needs</caption>
          <thead className="border-b border-nickel-300 text-meta text-flux-600">
            <tr>
              <th className="py-1 pr-3 font-semibold">Hole</th>
              <th className="py-1 pr-3 text-right font-semibold">Diameter</th>
              <th className="py-1 pr-3 text-right font-semibold">Collar</th>
              <th className="py-1 pr-3 text-right font-semibold">Collar gives</th>
              <th className="py-1 pr-3 text-right font-semibold">Collar needed, at least</th>
              <th className="py-1 font-semibold">Verdict</th>
            </tr>
          </thead>
          <tbody>
            {result.holes.map((h) => {
              const short = h.collarLength_mm < h.neededCollarLength_mm;
              return (
                <tr key={h.index} className="border-b border-nickel-100" data-testid="hole-row">
                  <td className="py-1 pr-3 font-semibold">{h.index + 1}</td>
                  <td className="py-1 pr-3 text-right font-mono">Ø {fmt(h.diameter_mm)} mm</td>
                  <td className="py-1 pr-3 text-right font-mono">{h.collarLength_mm > 0 ? `${fmt(h.collarLength_mm)} mm` : "none"}</td>
                  <td className="py-1 pr-3 text-right font-mono">{h.collarAttenuation_db.toFixed(0)} dB</td>
                  <td className="py-1 pr-3 text-right font-mono">{roundUpLength_mm(h.neededCollarLength_mm)} mm</td>
                  <td className={`py-1 font-semibold ${short ? "text-danger-700" : "text-ok-700"}`}>{short ? "too short" : "long enough"}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </ScrollX>
      <p className="text-meta text-flux-600" data-testid="hole-summary">
        {lost >= 0.05
          ? `The walls alone give about ${result.wallAttenuation_db.toFixed(1)} dB; leakage through the holes takes that to ${result.attenuation_db.toFixed(1)} dB, the figure above.`
          : `The holes cost less than 0.1 dB here: the walls decide the figure above.`}{" "}
        Collar figures take the weak case, the field along the collar; needed lengths aim at the walls' figure (at most 200 dB). Estimates, like every figure here.
      </p>
    </div>
  );
}
