import { useState } from "react";
import { Link } from "react-router-dom";
import type { AdvisedConfiguration, ClosestDesignJson, DesignAdviceJson, DesignCandidateJson } from "../../../shared/schemas/design-advice";
import { Button, buttonClass } from "../../components/ui/button";
import { ResponsiveTable, type Column } from "../../components/ui/responsive-table";
import { StatusNote } from "../../components/ui/status-note";
import { bandText, dbText, kgText, marginText, moneyText, outsideText } from "./advice-words";
import { defaultFrontSort, frontSortKeys, nextSort, sortFront, type FrontSort, type FrontSortKey } from "./front-sort";

/** Where "open in the design check" goes for a design (the page builds it: features do not import each other). */
export type DesignHref = (configuration: AdvisedConfiguration) => string;

type Row = { candidate: DesignCandidateJson; index: number };

function OpenLink({ href, candidate, primary = false }: { href: DesignHref; candidate: Pick<DesignCandidateJson, "configuration" | "summary">; primary?: boolean }) {
  return (
    <Link to={href(candidate.configuration)} className={primary ? buttonClass("primary") : "font-semibold text-anneal-700 underline underline-offset-2 hover:text-anneal-800"} data-testid="open-in-design-check">
      Open in the design check<span className="sr-only">: {candidate.summary}</span>
    </Link>
  );
}

/** The figures of one design as a short list: price, attenuation with its likely range, mass, size, margin. */
function Figures({ c }: { c: DesignCandidateJson | ClosestDesignJson }) {
  const items: Array<[string, string, string]> = [
    ["Unit price", moneyText(c.unitPrice_cents, c.currency), "unit-price"],
    ["Attenuation as built", `${dbText(c.attenuation_db)} (likely ${bandText(c)})`, "attenuation"],
    ["Mass", kgText(c.mass_kg), "mass"],
    ["Outside", outsideText(c), "outside"],
    ["Smallest saturation margin", marginText(c), "margin"],
  ];
  return (
    <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
      {items.map(([label, value, id]) => (
        <div key={id}>
          <dt className="text-meta text-flux-600">{label}</dt>
          <dd className="font-mono tabular text-flux-950" data-testid={`recommended-${id}`}>
            {value}
          </dd>
        </div>
      ))}
    </dl>
  );
}

/** The one design the answer recommends, why, and the way to it in the design check. */
export function Recommendation({ answer, href }: { answer: DesignAdviceJson; href: DesignHref }) {
  const pick = answer.recommended !== null ? answer.candidates[answer.recommended] : undefined;
  if (!pick) return null;
  return (
    <section className="space-y-4 rounded-lg border-2 border-ok-700 bg-white p-5 shadow-sm" aria-labelledby="recommended-title" data-testid="recommendation">
      <div>
        <p className="text-meta font-semibold uppercase tracking-wide text-ok-700">Recommended</p>
        <h2 id="recommended-title" className="text-h3" data-testid="recommended-summary">
          {pick.summary}
        </h2>
      </div>
      <Figures c={pick} />
      <p className="text-flux-800" data-testid="recommendation-reason">
        {answer.reason}
      </p>
      <OpenLink href={href} candidate={pick} primary />
    </section>
  );
}

/** Nothing meets the requirement (or nothing that does keeps the margin): why, and what comes nearest and what it lacks. */
export function NothingMeets({ answer, href }: { answer: DesignAdviceJson; href: DesignHref }) {
  const closest = answer.closest;
  return (
    <div className="space-y-4" data-testid="nothing-meets">
      <StatusNote tone="caution" word={answer.candidates.length ? "None keeps the margin" : "No design meets it"}>
        <p data-testid="no-design-reason">{answer.reason}</p>
      </StatusNote>
      {closest && (
        <section className="space-y-4 rounded-lg border border-caution-200 bg-white p-5 shadow-sm" aria-labelledby="closest-title" data-testid="closest">
          <div>
            <p className="text-meta font-semibold uppercase tracking-wide text-caution-700">Comes closest</p>
            <h2 id="closest-title" className="text-h3">
              {closest.summary}
            </h2>
          </div>
          <Figures c={closest} />
          <p className="text-flux-800">
            <span className="font-semibold">What it lacks:</span> <span data-testid="closest-lacks">{closest.lacks}</span>
          </p>
          <OpenLink href={href} candidate={closest} />
        </section>
      )}
    </div>
  );
}

const sortLabels: Record<FrontSortKey, string> = { price: "Unit price", attenuation: "As built", low: "Likely low end", mass: "Mass", outside: "Largest outside", layers: "Layers" };

function columns(href: DesignHref, recommended: number | null, withFront: boolean): Column<Row>[] {
  const mono = "whitespace-nowrap font-mono tabular";
  const cols: Column<Row>[] = [
    {
      key: "design",
      header: "Design",
      primary: true,
      className: "min-w-56",
      cell: ({ candidate, index }) => (
        <span className="block space-y-0.5">
          <span className="block">
            {candidate.summary}
            {index === recommended && <span className="ml-2 rounded bg-ok-700 px-1.5 py-0.5 text-meta font-semibold text-white">Recommended</span>}
          </span>
          <span className="block text-meta">
            <OpenLink href={href} candidate={candidate} />
          </span>
        </span>
      ),
    },
    { key: "price", header: sortLabels.price, align: "end", sortable: true, className: mono, cell: ({ candidate: c }) => <span data-testid="row-price">{moneyText(c.unitPrice_cents, c.currency)}</span> },
    { key: "attenuation", header: sortLabels.attenuation, align: "end", sortable: true, className: mono, cell: ({ candidate: c }) => <span data-testid="row-db">{dbText(c.attenuation_db)}</span> },
    { key: "low", header: sortLabels.low, align: "end", sortable: true, className: mono, cell: ({ candidate: c }) => dbText(c.band.low_db) },
    { key: "mass", header: sortLabels.mass, align: "end", sortable: true, className: mono, cell: ({ candidate: c }) => kgText(c.mass_kg) },
    { key: "outside", header: sortLabels.outside, align: "end", sortable: true, className: mono, sortLabel: "Largest outside size", cell: ({ candidate: c }) => outsideText(c) },
    { key: "layers", header: sortLabels.layers, align: "end", sortable: true, className: mono, cell: ({ candidate: c }) => String(c.configuration.layers.length) },
    { key: "margin", header: "Margin", align: "end", className: mono, cell: ({ candidate: c }) => <span className={c.keepsMargin ? "" : "font-semibold text-danger-700"}>{marginText(c)}{c.keepsMargin ? "" : " (too little)"}</span> },
  ];
  if (withFront) cols.push({ key: "front", header: "On the front", cell: ({ candidate: c }) => (c.front ? "yes" : "no") });
  return cols;
}

const FIRST_ROWS = 12;

/** The front as a table the person orders by any figure; the first dozen rows, the rest on request. */
export function FrontTable({ answer, href }: { answer: DesignAdviceJson; href: DesignHref }) {
  const [sort, setSort] = useState<FrontSort>(defaultFrontSort);
  const [all, setAll] = useState(false);
  const front = answer.candidates.map((candidate, index) => ({ candidate, index })).filter((r) => r.candidate.front);
  const rows = sortFront(front.map((r) => r.candidate), sort).map((r) => ({ candidate: r.candidate, index: front[r.index].index }));
  const shown = all ? rows : rows.slice(0, FIRST_ROWS);
  return (
    <div className="space-y-3">
      <ResponsiveTable
        caption="Designs on the front"
        columns={columns(href, answer.recommended, false)}
        rows={shown}
        rowKey={(r) => String(r.index)}
        testId="front-table"
        rowTestId="front-row"
        cardsBelow={860}
        rowClassName={(r) => (r.index === answer.recommended ? "bg-ok-50" : "")}
        sort={{
          key: sort.key,
          descending: sort.descending,
          onSort: (key, descending) => {
            if (!(frontSortKeys as readonly string[]).includes(key)) return;
            setSort(descending === undefined ? nextSort(sort, key as FrontSortKey) : { key: key as FrontSortKey, descending });
          },
        }}
      />
      {rows.length > FIRST_ROWS && (
        <Button variant="secondary" onClick={() => setAll((a) => !a)}>
          {all ? `Show the first ${FIRST_ROWS}` : `Show all ${rows.length} designs on the front`}
        </Button>
      )}
    </div>
  );
}

/** Every design listed, cheapest first: the chart's points in a table. */
export function AllCandidatesTable({ answer, href }: { answer: DesignAdviceJson; href: DesignHref }) {
  const rows = answer.candidates.map((candidate, index) => ({ candidate, index }));
  return (
    <ResponsiveTable
      caption="Every design on the chart"
      columns={columns(href, answer.recommended, true)}
      rows={rows}
      rowKey={(r) => String(r.index)}
      testId="all-candidates-table"
      cardsBelow={860}
    />
  );
}

/** How the search went, in one line: what was tried, what the bounds skipped, how long it took, which rates. */
export function SearchFacts({ answer }: { answer: DesignAdviceJson }) {
  const s = answer.search;
  const skipped = s.ruledOut.tooBig + s.ruledOut.tooHeavy + s.ruledOut.cannotReach + s.ruledOut.dominated + s.ruledOut.notMade;
  const n = (x: number) => x.toLocaleString("en-GB");
  return (
    <p className="text-meta text-flux-600" data-testid="search-facts">
      {n(answer.evaluated)} designs tried ({n(s.predicted)} predicted, {n(skipped)} ruled out early by size, mass or a bound that cannot drop a winner) in {(s.elapsed_ms / 1000).toFixed(1)} s;
      gauges {answer.gauges_mm.join(", ")} mm, gaps {answer.gapSteps_mm.join(", ")} mm; prices from shop rates version {answer.priceListVersion}
      {s.notListed > 0 ? `; ${n(s.notListed)} further designs meet it but are dearer and off the front, so they are not listed` : ""}.
    </p>
  );
}
