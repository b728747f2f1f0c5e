import type { ReactNode } from "react";

export type Tone = "ok" | "caution" | "danger" | "info";

// Fluxwright's notice: a tinted card with an even hairline edge, the tone's glyph in a round
// stamp, and the tone's word as a small label above the text (not a bold word run into it). Each
// tone carries its word and its glyph's shape as well as its colour, so it reads in greyscale and
// to a screen reader.
const tones: Record<Tone, { word: string; card: string; stamp: string; label: string; glyph: ReactNode }> = {
  ok: {
    word: "Done",
    card: "border-ok-200 bg-ok-50 text-ok-900",
    stamp: "bg-ok-700",
    label: "text-ok-700",
    glyph: <path d="M6.5 12.5l3.5 3.5 7.5-8" strokeWidth="2.6" />,
  },
  caution: {
    word: "Caution",
    card: "border-caution-200 bg-caution-50 text-caution-900",
    stamp: "bg-caution-700",
    label: "text-caution-700",
    glyph: <path d="M12 6.5v7M12 17.25v.5" strokeWidth="2.8" />,
  },
  danger: {
    word: "Problem",
    card: "border-danger-200 bg-danger-50 text-danger-900",
    stamp: "bg-danger-700",
    label: "text-danger-700",
    glyph: <path d="M8 8l8 8M16 8l-8 8" strokeWidth="2.6" />,
  },
  info: {
    word: "Note",
    card: "border-flux-200 bg-flux-50 text-flux-900",
    stamp: "bg-flux-600",
    label: "text-flux-600",
    glyph: <path d="M12 10.5v7M12 6.5v.5" strokeWidth="2.8" />,
  },
};

interface StatusNoteProps {
  tone: Tone;
  children: ReactNode;
  /** Replaces the tone's own word ("Problem", "Done" …) in the label above the message. */
  word?: string;
  /**
   * Only a note that appears in answer to what the person just did is a live region: "polite"
   * (a save, a sent invitation) is read when the reader is idle, "assertive" (a refused form) at
   * once. Notes that are part of the page (cautions, warnings, hints) are not announced.
   */
  live?: "polite" | "assertive";
  className?: string;
}

export function StatusNote({ tone, children, word, live, className = "" }: StatusNoteProps) {
  const style = tones[tone];
  return (
    <div
      role={live === "assertive" ? "alert" : live === "polite" ? "status" : undefined}
      data-tone={tone}
      className={`notice flex items-start gap-3 rounded-lg border px-4 py-3 ${style.card} ${className}`}
    >
      <span className={`mt-0.5 grid size-6 shrink-0 place-items-center rounded-full ${style.stamp}`} aria-hidden="true">
        <svg className="size-4 text-white" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeLinecap="round" strokeLinejoin="round">
          {style.glyph}
        </svg>
      </span>
      <div className="min-w-0 space-y-0.5">
        <p className={`font-mono text-[0.8125rem] uppercase leading-5 tracking-wider ${style.label}`}>{word ?? style.word}</p>
        <div>{children}</div>
      </div>
    </div>
  );
}
