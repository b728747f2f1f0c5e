import { useEffect, useMemo, useRef, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import type { DesignAdviceJson, DesignAdviceRequest } from "../../../shared/schemas/design-advice";
import { blamesInputs } from "../../api/client";
import { designAdviceKeys, designAdviceQueryOptions } from "../../api/design-advice";
import { materialsQueryOptions } from "../../api/materials";
import { ServerTrouble } from "../../components/server-trouble";
import { Disclosure } from "../../components/ui/disclosure";
import { Panel } from "../../components/ui/panel";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { formatInUnit } from "../../components/ui/unit-input";
import { useLastGood } from "../../lib/use-last-good";
import { useSearchState } from "../../lib/use-search-state";
import { AdviceChart } from "./advice-chart";
import { ElapsedClock } from "./elapsed-clock";
import { AllCandidatesTable, FrontTable, NothingMeets, Recommendation, SearchFacts, type DesignHref } from "./advice-parts";
import { dbText, moneyText } from "./advice-words";
import { RequirementForm } from "./requirement-form";
import { checkRequirement, defaultRequirement, readAsked, requirementErrors, requirementToParams, writeAsked, type AdviceUnits, type RequirementDraft } from "./requirement-model";

/** The requirement an answer belongs to, in a line: "60 dB at 60 Hz, 100 µT across a can 50 × 120 mm inside, 10 off". */
function requirementText(r: DesignAdviceRequest, units: AdviceUnits): string {
  const L = (mm: number) => formatInUnit("length", mm, units.length);
  const d = r.dimensions_mm as Record<string, number>;
  const space = r.shape === "box" ? `a box ${L(d.width)} × ${L(d.depth)} × ${L(d.height)} inside` : `a can Ø ${L(d.diameter)} × ${L(d.length)} inside`;
  const direction = r.shape === "box" ? "across" : r.field.orientation === "axial" ? "along" : "across";
  const f = r.field.frequency_hz === 0 ? "a static field" : formatInUnit("frequency", r.field.frequency_hz, units.frequency);
  return `${dbText(r.requiredAttenuation_db)} at ${f}, ${formatInUnit("flux", r.field.amplitude_uT, units.field)} ${direction} ${space}, ${r.quantity} off`;
}

/** What a screen reader is told when an answer arrives. */
function answerWords(a: DesignAdviceJson): string {
  const pick = a.recommended !== null ? a.candidates[a.recommended] : undefined;
  if (!pick) return `Search done: ${a.reason}`;
  return `Search done: ${a.candidates.length} designs listed, ${a.candidates.filter((c) => c.front).length} on the front. Recommended: ${pick.summary}, ${moneyText(pick.unitPrice_cents, pick.currency)}, ${dbText(pick.attenuation_db)}.`;
}

/**
 * The design advisor: a requirement in, the designs the shop can make that meet it out, with
 * their price against attenuation, the front and one recommendation. The asked requirement lives
 * in the address bar (reload repeats the search, a link shares it, Back returns to the last one);
 * the form is edited freely and searched on request, since a search takes a second or more.
 */
export function FindADesign({ designHref }: { designHref: DesignHref }) {
  const queryClient = useQueryClient();
  const [asked, setAsked] = useSearchState(readAsked, writeAsked);
  const [draft, setDraft] = useState<RequirementDraft>(() => asked ?? defaultRequirement());
  // Back, forward or a link brought another requirement: the form shows it
  const [formFor, setFormFor] = useState(asked);
  if (asked !== formFor) {
    setFormFor(asked);
    if (asked) setDraft(asked);
  }
  const [tried, setTried] = useState(asked !== null);
  const [stopped, setStopped] = useState(false);
  const materials = useQuery(materialsQueryOptions);

  const checkedAsked = useMemo(() => (asked ? checkRequirement(asked) : null), [asked]);
  const request = checkedAsked?.request ?? null;
  const search = useQuery({ ...designAdviceQueryOptions(request!), enabled: request !== null, refetchOnWindowFocus: false });
  const fresh = search.isSuccess && !search.isPlaceholderData;
  const answer = useLastGood(search.data, fresh);
  const [answerFor, setAnswerFor] = useState<{ request: DesignAdviceRequest; units: AdviceUnits } | null>(null);
  if (fresh && request && asked && answerFor?.request !== request) setAnswerFor({ request, units: asked.units });

  const searching = search.isFetching;
  const refused = search.isError && blamesInputs(search.error) ? search.error : null;
  const inputProblem = refused !== null;
  const serverProblem = search.isError && !inputProblem;
  const draftIsAsked = asked !== null && requirementToParams(draft).toString() === requirementToParams(asked).toString();
  const clientErrors = tried ? (checkRequirement(draft).errors ?? {}) : {};
  const serverErrors = refused && draftIsAsked ? requirementErrors(refused.fields) : {};
  const errors = { ...serverErrors, ...clientErrors };
  const answerIsCurrent = answer !== undefined && answerFor !== null && answerFor.request === request && fresh;

  // on a phone the answer is under the form: bring it into view when the one asked for arrives
  const answerRef = useRef<HTMLDivElement>(null);
  const [awaiting, setAwaiting] = useState(false);
  useEffect(() => {
    if (!awaiting || !answerIsCurrent || searching) return;
    setAwaiting(false);
    const el = answerRef.current;
    if (el && el.getBoundingClientRect().top > window.innerHeight * 0.5) el.scrollIntoView({ block: "start" });
  }, [awaiting, answerIsCurrent, searching]);

  const runSearch = () => {
    setTried(true);
    const checked = checkRequirement(draft);
    if (checked.errors) return;
    setStopped(false);
    setAwaiting(true);
    if (draftIsAsked) void search.refetch();
    else setAsked(draft, "commit");
  };
  const stop = () => {
    if (!request) return;
    setStopped(true);
    void queryClient.cancelQueries({ queryKey: designAdviceKeys.search(request) });
  };

  return (
    <div className="grid items-start gap-6 lg:grid-cols-[minmax(20rem,24rem)_minmax(0,1fr)] xl:grid-cols-[26rem_minmax(0,1fr)]">
      <Panel title="Your requirement" className="min-w-0">
        <RequirementForm
          draft={draft}
          onChange={setDraft}
          errors={errors}
          materials={materials.data ?? []}
          materialsError={materials.isError}
          onSearch={runSearch}
          searching={searching}
          onStop={stop}
        />
      </Panel>

      <div ref={answerRef} className="min-w-0 scroll-mt-4 space-y-6" id="answer" aria-busy={searching || undefined} data-testid="advice-answer">
        <p role="status" className="sr-only" data-testid="answer-announcement">
          {searching ? "Searching designs…" : answerIsCurrent && answer ? answerWords(answer) : stopped ? "Search stopped." : ""}
        </p>
        {searching && (
          <div className="flex items-start gap-3 rounded-lg border border-flux-200 bg-flux-50 px-4 py-3 text-flux-900" data-testid="search-progress">
            <Spinner className="mt-0.5 size-5 shrink-0" />
            <span className="min-w-0">
              Searching the designs the shop can make: every alloy, gauge, layer count, gap and method within your limits, each predicted and priced.{" "}
              <ElapsedClock className="font-mono tabular" />
            </span>
          </div>
        )}
        {stopped && !searching && (
          <StatusNote tone="info" word="Stopped">
            <p data-testid="search-stopped">The search was stopped before it finished. {answer ? "The answer shown is from the earlier requirement." : ""} Press “Search designs” to run it again.</p>
          </StatusNote>
        )}
        {serverProblem && <ServerTrouble error={search.error} what="the designs" kept={answer !== undefined} onRetry={() => void search.refetch()} />}
        {inputProblem && !draftIsAsked && (
          <StatusNote tone="danger" word="Not searched">
            <p>The last requirement searched was not accepted: {refused?.message}</p>
          </StatusNote>
        )}
        {inputProblem && draftIsAsked && (
          <StatusNote tone="danger" word="Not searched">
            <p data-testid="requirement-refused">{errors.constraints ?? "The requirement was not accepted: see the messages beside the fields."}</p>
          </StatusNote>
        )}

        {answer && answerFor ? (
          <div className={`space-y-6 ${answerIsCurrent ? "" : "border-l-4 border-dashed border-flux-300 pl-3"}`} data-testid="advice" data-current={answerIsCurrent}>
            <p className="text-flux-800" data-testid="answer-for">
              {answerIsCurrent ? "Designs for " : "Still showing the answer for "}
              <span className="font-semibold">{requirementText(answerFor.request, answerFor.units)}</span>
              {answerIsCurrent ? "." : searching ? ", while the new requirement is searched." : "."}
            </p>
            <StatusNote tone="info" word="Estimates">
              Every attenuation here is an engineering estimate from published formulas, the alloys' design values and the shop's allowance for welds, joints and lid fit, with the range a built shield is likely to fall in. A design is listed only when even the low end of its range meets what you asked. The figure measured on the finished shield, written on its certificate, is the one that counts; for medical, life-safety or other critical equipment, have the design reviewed by your own qualified engineer.
            </StatusNote>
            {answer.recommended !== null ? <Recommendation answer={answer} href={designHref} /> : <NothingMeets answer={answer} href={designHref} />}
            {answer.candidates.length > 0 && (
              <Panel title="Price against attenuation">
                <AdviceChart candidates={answer.candidates} recommended={answer.recommended} required_db={answerFor.request.requiredAttenuation_db} evaluated={answer.evaluated} currency={answer.currency} />
              </Panel>
            )}
          </div>
        ) : (
          !searching &&
          !search.isError && (
            <Panel title="No search yet">
              <div className="space-y-3 text-flux-800" data-testid="no-search-yet">
                <p>Describe the space to protect, the field it sits in and the attenuation you need, then press “Search designs”.</p>
                <p>
                  The search tries every design the shop can make within your limits (alloy, sheet gauge, number of layers, gap between them, how it is formed), predicts and prices each one, and shows those that meet your need: their price against attenuation, the ones no other design beats on price, mass and attenuation at once, and the one we recommend.
                </p>
              </div>
            </Panel>
          )
        )}
      </div>

      {/* the tables take the page's whole width: a laptop shows the front as a table, not as cards */}
      {answer && answerFor && (
        <div className={`min-w-0 space-y-6 lg:col-span-2 ${answerIsCurrent ? "" : "border-l-4 border-dashed border-flux-300 pl-3"}`} data-testid="advice-tables">
          {answer.candidates.length > 0 && (
            <>
              <Panel title="The front: cheapest for what they give">
                <p className="mb-3 text-meta text-flux-600">
                  A design is on the front when no other is at once cheaper, lighter and stronger. Order the table by any figure; open any design in the design check to see it drawn, save it or have it quoted.
                </p>
                <FrontTable answer={answer} href={designHref} />
              </Panel>
              <Disclosure title="Every design on the chart, as a table" digest={`${answer.candidates.length} designs, cheapest first`} testId="all-candidates">
                <AllCandidatesTable answer={answer} href={designHref} />
              </Disclosure>
            </>
          )}
          <SearchFacts answer={answer} />
        </div>
      )}
    </div>
  );
}
