import { useState } from "react";
import { Link } from "react-router-dom";
import { useQueries, useQuery } from "@tanstack/react-query";
import type { BlankRequest } from "../../../shared/schemas/blank";
import type { PredictionRequest } from "../../../shared/schemas/prediction";
import { meQueryOptions } from "../../api/auth";
import { ApiError, blamesInputs } from "../../api/client";
import { blankQueryOptions, priceEstimateQueryOptions, type BlankResponse } from "../../api/fabrication";
import { PriceBreakdown } from "../../components/pricing/price-breakdown";
import { ServerTrouble } from "../../components/server-trouble";
import { useLastGood } from "../../lib/use-last-good";
import { plainScale, UnitInput } from "../../components/ui/unit-input";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { paths } from "../../config/paths";
import { useDebounced } from "../../lib/use-debounced";
import { lengthText, sizeText, type DesignLengthUnit } from "./design-model";
import { flatBlankPrefill, layerBlankRequests, methodOf, toPriceEstimateBody, tooManyDraws, type MakeMethod } from "./make-model";

const METHOD_WORDS: Record<MakeMethod, string> = { drawn: "Deep-drawn can", rolled: "Rolled and seam-welded can", bent: "Bent box" };

function blankSize(r: BlankResponse, unit: DesignLengthUnit): string {
  const L = (mm: number) => lengthText(mm, unit, 5);
  const b = r.blank;
  if (b.kind === "disc") return `Disc Ø ${L(b.diameter_mm)}`;
  const main = `${b.kind === "cross" ? "Cross" : "Rectangle"} ${sizeText([b.length_mm, b.width_mm], unit)}`;
  if (r.method === "rolled") return `${main} + 2 discs Ø ${L(r.endCaps[0].diameter_mm)}`;
  if (r.method === "bent" && r.lid) return `${main}; lid: cross ${sizeText([r.lid.blank.length_mm, r.lid.blank.width_mm], unit)}`;
  return main;
}

function forming(r: BlankResponse, unit: DesignLengthUnit): string {
  const L = (mm: number) => lengthText(mm, unit, 3);
  if (r.method === "drawn") {
    const n = r.drawStages.length;
    return `${n} draw${n === 1 ? "" : "s"} · ${r.processAnneals === 0 ? "no process anneal" : `${r.processAnneals} process anneal${r.processAnneals === 1 ? "" : "s"}`}`;
  }
  if (r.method === "bent") return `${r.bendCount} bends${r.lid ? " + 4 on the lid" : ""} · ${L(r.weldLength_mm)} corner welds`;
  return `rolled · ${L(r.weldLength_mm)} seam weld · 2 end discs welded on`;
}

const kg = (x: number) => `${x.toFixed(3)} kg`;

/** What the design takes to make: one part per layer, its blank, forming and mass; signed in, the price. */
export function MakePanel({ request, unit = "mm" }: { request: PredictionRequest; unit?: DesignLengthUnit }) {
  const L = (mm: number) => lengthText(mm, unit, 5);
  const me = useQuery(meQueryOptions);
  const [quantity, setQuantity] = useState<number | null>(10);
  // made as the design says (its construction also sets the as-built figure)
  const method = methodOf(request);

  const requests: BlankRequest[] = method ? layerBlankRequests(request, method) : [];
  const blanks = useQueries({ queries: requests.map((b) => ({ ...blankQueryOptions(b), retry: false })) });
  const draws = method === "drawn" && blanks.every((q) => q.data?.method === "drawn") ? blanks.map((q) => (q.data?.method === "drawn" ? q.data.drawStages.length : 0)) : null;
  const manyDraws = tooManyDraws(draws);

  const signedIn = Boolean(me.data);
  const priceBody = useDebounced(toPriceEstimateBody(request, method, quantity), 300);
  const estimate = useQuery({
    ...priceEstimateQueryOptions(priceBody.ok ? priceBody.body : { configuration: { shape: "cylinder", method: "drawn", dimensions_mm: {}, layers: [] }, quantity: 1 }),
    enabled: signedIn && priceBody.ok,
    retry: false,
  });
  const priced = useLastGood(estimate.data, estimate.isSuccess && !estimate.isPlaceholderData);

  if (request.shape === "sphere" || !method) {
    return (
      <StatusNote tone="info" word="Not made here">
        A sphere is not made on this shop's routings (deep-drawn or rolled cans, bent boxes), so there is no blank and no price for it. A can or a box of similar size can be checked instead.
      </StatusNote>
    );
  }

  const masses = blanks.map((q) => q.data?.mass_kg);
  const allMassesKnown = blanks.length > 0 && masses.every((m) => m !== undefined);
  const known = masses.filter((m): m is number => m !== undefined);
  const total = known.reduce((s, m) => s + m, 0);
  const customLayers = request.layers.flatMap((l, i) => (l.material ? [] : [i + 1]));
  // holes with a collar are parts of their own (the price route makes them); a plain hole is only cut
  const collared = (request.holes ?? []).filter((h) => h.collarLength_mm > 0);
  const collarParts = priced ? priced.parts.filter((p) => p.role === "collar") : [];
  const collarMass = collarParts.reduce((sum, p) => sum + (p.mass_kg ?? 0) * p.quantityPerAssembly, 0);
  const fetching = blanks.some((q) => q.isFetching);

  return (
    <div className="space-y-5" data-testid="make-panel">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <p className="text-flux-700" data-testid="make-method">
          {method === "bent"
            ? "Each box layer is bent from a cross-shaped blank, corners welded, with a bent lid."
            : method === "rolled"
              ? "Each layer is rolled and seam-welded, with a welded bottom disc and a slip-on lid disc."
              : "Each layer is deep-drawn from a disc, with a slip-on lid."}{" "}
          Change it under “How it is made” in the design.
        </p>
        {fetching && (
          <span className="flex items-center gap-2 text-meta text-flux-600" aria-live="polite">
            <Spinner /> Working out the blanks…
          </span>
        )}
      </div>
      {manyDraws !== null && (
        <StatusNote tone="caution" word="Many draws">
          A drawn can needs {manyDraws} draws here, with process anneals between them; rolled and seam-welded is usually cheaper for a can this deep.
        </StatusNote>
      )}

      <ol className="space-y-3" aria-label="Parts, one per layer" data-testid="make-parts">
        {requests.map((b, i) => {
          const q = blanks[i];
          const r = q.data;
          const layer = request.layers[i];
          return (
            <li key={i} className="rounded-md border border-nickel-200 p-3" data-testid="make-part">
              <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
                <span className="font-semibold text-flux-900">
                  Layer {i + 1} · {METHOD_WORDS[method]} · {layer.material ?? "custom μr"} {L(layer.thickness_mm)}
                </span>
                <Link className="text-meta font-semibold text-flux-700 underline underline-offset-4" to={paths.flatBlank.href(flatBlankPrefill(b))} data-testid="flat-blank-link">
                  Flat pattern and DXF for layer {i + 1}
                </Link>
              </div>
              <p className="text-meta text-flux-600">
                Inside {b.shape === "box" ? sizeText([b.dimensions_mm.width, b.dimensions_mm.depth, b.dimensions_mm.height], unit) : `Ø ${sizeText([b.dimensions_mm.diameter, b.dimensions_mm.length], unit)}`}
              </p>
              {q.isError ? (
                <p className="mt-1 text-meta font-semibold text-danger-700">
                  {blamesInputs(q.error) && Object.keys(q.error.fields).length
                    ? Object.values(q.error.fields).join(" ")
                    : `The server could not work this blank out just now (${q.error instanceof ApiError ? q.error.message : "no answer"}); your design is not the problem.`}
                </p>
              ) : r ? (
                <dl className="mt-2 flex flex-wrap gap-x-8 gap-y-2">
                  <div>
                    <dt className="text-meta text-flux-600">Blank</dt>
                    <dd className="font-mono text-flux-950" data-testid="make-blank-size">{blankSize(r, unit)}</dd>
                  </div>
                  <div>
                    <dt className="text-meta text-flux-600">Forming</dt>
                    <dd className="text-flux-950">{forming(r, unit)}</dd>
                  </div>
                  <div>
                    <dt className="text-meta text-flux-600">Mass</dt>
                    <dd className="font-mono text-flux-950">{r.mass_kg !== undefined ? kg(r.mass_kg) : "— (no library material)"}</dd>
                  </div>
                </dl>
              ) : (
                <p className="mt-1 text-meta text-flux-600">Working out the blank…</p>
              )}
            </li>
          );
        })}
      </ol>

      {collared.length > 0 && (
        <section className="space-y-2" aria-label="Collars" data-testid="make-collars">
          <h3 className="font-semibold text-flux-900">
            Collars: {collared.length} hole{collared.length === 1 ? "" : "s"} × {request.layers.length} layer{request.layers.length === 1 ? "" : "s"} = {collared.length * request.layers.length} rolled, welded tube{collared.length * request.layers.length === 1 ? "" : "s"}
          </h3>
          {collarParts.length > 0 ? (
            <ul className="space-y-1 text-meta text-flux-700">
              {collarParts.map((p, k) => {
                const hole = collared[k % collared.length];
                return (
                  <li key={k} data-testid="make-collar">
                    Layer {p.layer + 1} · collar for the Ø {L(hole.diameter_mm)} hole, {L(hole.collarLength_mm)} long · blank{" "}
                    <span className="font-mono">{p.blank.kind === "disc" ? `disc Ø ${L(p.blank.diameter_mm)}` : sizeText([p.blank.length_mm, p.blank.width_mm], unit)}</span>
                    {p.mass_kg !== undefined ? ` · ${kg(p.mass_kg)}` : ""}
                  </li>
                );
              })}
            </ul>
          ) : (
            <p className="text-meta text-flux-600">
              Each layer's collar telescopes over the one inside it and is welded on before the anneal.{signedIn ? "" : " Sign in to see their blanks and their share of the price."}
            </p>
          )}
        </section>
      )}

      <p className="text-flux-900" data-testid="make-total-mass">
        <strong>Material in the blanks, per shield:</strong> {known.length ? kg(total + collarMass) : "—"}
        {!allMassesKnown && known.length > 0 ? " (layers with a library material only)" : ""}
        {collared.length > 0 ? (collarParts.length > 0 ? ", collars included" : ", collars not included") : ""}. Blank mass before trimming; the scrap between blanks is priced with the material.
      </p>
      {customLayers.length > 0 && (
        <StatusNote tone="info" word="No price">
          Layer {customLayers.join(" and ")} {customLayers.length === 1 ? "has" : "have"} a custom μr rather than a library material: the shop cannot say what it weighs or costs. Choose a library material to see the mass and the price.
        </StatusNote>
      )}

      {!signedIn ? (
        <p className="rounded-md bg-nickel-50 px-3 py-2 text-flux-800" data-testid="make-sign-in">
          <Link className="font-semibold text-flux-700 underline underline-offset-4" to={paths.signIn.href(paths.designCheck.href())}>
            Sign in to see the price
          </Link>{" "}
          of this design: every line of the build-up, the price per piece and the nesting on the stock sheet.
        </p>
      ) : (
        customLayers.length === 0 && (
          <section className="space-y-4" aria-label="Price estimate">
            <div className="flex flex-wrap items-end justify-between gap-4">
              <div className="w-40">
                <UnitInput label="Quantity" name="makeQuantity" inputMode="numeric" scale={plainScale} value={quantity} onValueChange={setQuantity} error={!priceBody.ok && priceBody.reason === "quantity" ? priceBody.message : undefined} />
              </div>
              {estimate.isFetching && (
                <span className="flex items-center gap-2 text-meta text-flux-600">
                  <Spinner /> Pricing…
                </span>
              )}
            </div>
            {estimate.isError && blamesInputs(estimate.error) && (
              <StatusNote tone="danger" word="No price for these values">
                {Object.keys(estimate.error.fields).length ? Object.values(estimate.error.fields).join(" ") : estimate.error.message}
              </StatusNote>
            )}
            {estimate.isError && !blamesInputs(estimate.error) && <ServerTrouble error={estimate.error} what="the price" kept={Boolean(priced)} onRetry={() => void estimate.refetch()} />}
            {!priced && estimate.isPending && priceBody.ok && <p className="text-flux-600">Pricing…</p>}
            {priced && <PriceBreakdown estimate={priced} dimmed={estimate.isError || estimate.isPlaceholderData || !priceBody.ok} />}
          </section>
        )
      )}
      <p className="text-meta text-flux-600">
        Blank sizes, masses and prices are estimates from the shop's formulas and current price list; the quote and the drawings checked by the shop are the ones that count.
        {request.shape === "cylinder" && request.ends === "open" ? " The can is priced with its closed end(s) as made; an open-ended tube is quoted on request." : ""}
      </p>
    </div>
  );
}
