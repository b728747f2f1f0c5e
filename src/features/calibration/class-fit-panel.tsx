import { Link } from "react-router-dom";
import type { CalibrationOverviewJson } from "../../api/calibration";
import { paths } from "../../config/paths";
import { Panel } from "../../components/ui/panel";
import { StatusNote } from "../../components/ui/status-note";
import { FitScatter } from "./fit-scatter";
import { classWords, db, grouped, when } from "./words";

type Fit = CalibrationOverviewJson["fits"][number];

const plusMinus = (x: number | null, unit = "", digits = 2) => (x === null ? "" : ` ± ${grouped(x, digits)}${unit}`);

/** One class's fit: the values with their uncertainty, the errors before and after, the scatter, the lots left out. */
export function ClassFitPanel({ fit }: { fit: Fit }) {
  const title = classWords(fit);
  const better = fit.error_db.crossValidated < fit.error_db.library;
  return (
    <Panel title={title} className="space-y-4">
      <div data-testid="class-fit" data-class={`${fit.material}|${fit.method}|${fit.construction}`} className="space-y-4">
        <StatusNote tone={fit.inUse ? "ok" : "info"} word={fit.inUse ? "In use" : "Library values stand"}>
          {fit.verdict}
        </StatusNote>
        <dl className="grid gap-x-6 gap-y-2 text-body sm:grid-cols-2 lg:grid-cols-3">
          <div>
            <dt className="text-meta text-flux-600">Effective low-field μr</dt>
            <dd className="font-mono tabular" data-testid="fit-mu">
              {grouped(fit.mu_effective)}{plusMinus(fit.uncertainty.mu_effective)} <span className="text-flux-600">(library {grouped(fit.library.mu_effective)})</span>
            </dd>
          </div>
          <div>
            <dt className="text-meta text-flux-600">Construction ceiling, one layer</dt>
            <dd className="font-mono tabular">
              {fit.mode === "mu-only" ? `${db(fit.ceiling_db)} (shop setting, not fitted)` : `${db(fit.ceiling_db)}${plusMinus(fit.uncertainty.ceiling_db, " dB")}`}{" "}
              <span className="text-flux-600">(setting {db(fit.library.ceiling_db)})</span>
            </dd>
          </div>
          <div>
            <dt className="text-meta text-flux-600">Lots used</dt>
            <dd className="font-mono tabular">{fit.lots} of {fit.lotsMeasured} measured · {fit.parts} parts · {fit.conditions} designs × test frequencies</dd>
          </div>
        </dl>
        <p className="text-meta text-flux-700">{fit.identifiability} Uncertainties: {fit.uncertainty.basis}.</p>
        <table className="w-full max-w-xl text-body" data-testid="fit-errors">
          <caption className="text-left text-meta text-flux-600">Median absolute error of predicted against measured attenuation</caption>
          <thead>
            <tr className="border-b border-nickel-200 text-left text-meta text-flux-600">
              <th scope="col" className="py-1 pr-3 font-normal">Prediction</th>
              <th scope="col" className="py-1 text-right font-normal">Error</th>
            </tr>
          </thead>
          <tbody className="font-mono tabular">
            <tr><th scope="row" className="py-1 pr-3 text-left font-sans font-normal">Library values (before)</th><td className="text-right">{db(fit.error_db.library)}</td></tr>
            <tr><th scope="row" className="py-1 pr-3 text-left font-sans font-normal">Fit, on the same lots</th><td className="text-right">{db(fit.error_db.fitted)}</td></tr>
            <tr className={better ? "text-ok-800" : "text-danger-800"}>
              <th scope="row" className="py-1 pr-3 text-left font-sans font-semibold">Fit, in {fit.folds}-fold cross-validation (the figure that counts)</th>
              <td className="text-right font-semibold" data-testid="error-cv">{db(fit.error_db.crossValidated)}</td>
            </tr>
          </tbody>
        </table>
        <FitScatter points={fit.points} title={title} />
        <p className="text-meta text-flux-700">Band of a calibrated prediction: {db(fit.band_db.below)} below to {db(fit.band_db.above)} above the figure ({fit.band_db.basis}).</p>
        <div>
          <h3 className="text-h5 font-semibold">Left out as outliers</h3>
          {fit.leftOut.length === 0 ? (
            <p className="text-meta text-flux-700">None.</p>
          ) : (
            <ul className="space-y-1 text-body" data-testid="left-out">
              {fit.leftOut.map((o) => (
                <li key={`${o.lotId}-${o.serial ?? ""}`}>
                  <Link className="font-mono underline" to={paths.measuredLot.href(o.lotId)}>{o.kind === "part" ? `${o.serial}` : `Lot ${o.lotNumber}`}</Link>: {o.reason}
                </li>
              ))}
            </ul>
          )}
        </div>
        <p className="text-meta text-flux-600">Fitted {when(fit.fittedAt)}.</p>
      </div>
    </Panel>
  );
}
