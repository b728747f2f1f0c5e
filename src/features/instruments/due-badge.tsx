import type { InstrumentJson } from "../../api/instruments";
import { dueWords, type DueState } from "./due-state";

// The state's word is the message; the tint and the glyph's shape repeat it for a glance.
const look: Record<DueState, { chip: string; glyph: string }> = {
  overdue: { chip: "border-danger-200 bg-danger-50 text-danger-900", glyph: "M8 8l8 8M16 8l-8 8" },
  out: { chip: "border-flux-200 bg-flux-50 text-flux-900", glyph: "M5 12h11M12 7l5 5-5 5" },
  "due-soon": { chip: "border-caution-200 bg-caution-50 text-caution-900", glyph: "M12 6.5v7M12 17.25v.5" },
  "in-date": { chip: "border-ok-200 bg-ok-50 text-ok-900", glyph: "M6.5 12.5l3.5 3.5 7.5-8" },
};

/** The instrument's calibration state as a labelled chip, with what it means beside it when `detail`. */
export function DueBadge({ instrument, detail = false }: { instrument: InstrumentJson; detail?: boolean }) {
  const words = dueWords(instrument);
  const style = look[words.state];
  return (
    <span className="inline-flex flex-wrap items-baseline gap-x-2 gap-y-1" data-testid="due-state" data-state={words.state}>
      <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded border px-1.5 py-0.5 text-meta font-semibold ${style.chip}`}>
        <svg className="size-3.5 shrink-0" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth="2.8" strokeLinecap="round" strokeLinejoin="round" aria-hidden="true">
          <path d={style.glyph} />
        </svg>
        {words.label}
      </span>
      {detail && <span className="text-meta text-flux-700">{words.detail}</span>}
    </span>
  );
}
