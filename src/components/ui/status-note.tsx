import type { ReactNode } from "react";

export type Tone = "ok" | "caution" | "danger" | "info";

// Each tone carries a word and a shape as well as a colour, so it reads in greyscale and to a
// screen reader.
const tones: Record<Tone, { word: string; box: string; icon: ReactNode }> = {
  ok: {
    word: "Done",
    box: "border-ok-700 bg-ok-50 text-ok-900",
    icon: <path d="M5 12.5l4.5 4.5L19 7.5" strokeWidth="2.5" />,
  },
  caution: {
    word: "Caution",
    box: "border-caution-700 bg-caution-50 text-caution-900",
    icon: (
      <>
        <path d="M12 3.5L22 20.5H2L12 3.5z" strokeWidth="2" strokeLinejoin="round" />
        <path d="M12 10v4.5M12 17.5v.5" strokeWidth="2.2" />
      </>
    ),
  },
  danger: {
    word: "Problem",
    box: "border-danger-700 bg-danger-50 text-danger-900",
    icon: (
      <>
        <circle cx="12" cy="12" r="9.5" strokeWidth="2" />
        <path d="M8.5 8.5l7 7M15.5 8.5l-7 7" strokeWidth="2.2" />
      </>
    ),
  },
  info: {
    word: "Note",
    box: "border-flux-500 bg-flux-50 text-flux-900",
    icon: (
      <>
        <circle cx="12" cy="12" r="9.5" strokeWidth="2" />
        <path d="M12 11v6M12 7.5v.5" strokeWidth="2.2" />
      </>
    ),
  },
};

interface StatusNoteProps {
  tone: Tone;
  children: ReactNode;
  /** Replaces the default word ("Problem", "Done" …) printed before the message. */
  word?: string;
  /** Announce immediately (form errors) rather than politely. */
  assertive?: boolean;
  className?: string;
}

export function StatusNote({ tone, children, word, assertive = false, className = "" }: StatusNoteProps) {
  const style = tones[tone];
  return (
    <div
      role={assertive ? "alert" : "status"}
      className={`flex items-start gap-3 rounded-md border-l-4 px-4 py-3 ${style.box} ${className}`}
    >
      <svg className="mt-0.5 size-5 shrink-0" viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeLinecap="round" aria-hidden="true">
        {style.icon}
      </svg>
      <div>
        <strong className="font-semibold">{word ?? style.word}:</strong> {children}
      </div>
    </div>
  );
}
