import { useEffect, useRef, useState } from "react";

/** The figures of a result a screen reader is told about, by name: {"Attenuation as built": "62.3 dB"}. */
export type Figures = Record<string, string>;

/**
 * What changed between two sets of figures, as one sentence: "Attenuation as built now 62.3 dB
 * (was 58.1 dB); likely range now 55–68 dB (was 51–64 dB)." Empty when nothing changed, and for
 * the first figures (they arrive with the page, which is read anyway).
 */
export function describeChanges(before: Figures | null, after: Figures): string {
  if (!before) return "";
  const parts: string[] = [];
  for (const [name, value] of Object.entries(after)) {
    const old = before[name];
    if (old === value) continue;
    parts.push(old === undefined ? `${name}: ${value}` : `${name} now ${value} (was ${old})`);
  }
  for (const name of Object.keys(before)) if (!(name in after)) parts.push(`${name}: no longer shown`);
  if (!parts.length) return "";
  const sentence = parts.join("; ");
  return `${sentence[0].toUpperCase()}${sentence.slice(1)}.`;
}

/**
 * Keeps one polite live region's text: once the figures have settled (`settled`), it says what
 * changed since it last spoke, so a screen reader hears the difference, not the whole result on
 * every keystroke.
 */
export function useChangeAnnouncement(figures: Figures | null, settled: boolean): string {
  const spoken = useRef<Figures | null>(null);
  const [message, setMessage] = useState("");
  const key = figures ? JSON.stringify(figures) : "";
  useEffect(() => {
    if (!settled || !key) return;
    const next = JSON.parse(key) as Figures;
    const text = describeChanges(spoken.current, next);
    spoken.current = next;
    if (text) setMessage(text);
  }, [key, settled]);
  return message;
}
