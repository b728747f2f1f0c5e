/** The serial after the last one typed: "L26-1007-07" → "L26-1007-08"; with none yet, the lot's first. Pure. */
export function nextSerial(taken: readonly string[], lotNumber: string): string {
  const last = taken.at(-1);
  if (!last) return `${lotNumber}-01`;
  const m = /^(.*?)(\d+)$/.exec(last);
  if (!m) return `${last}-2`;
  const n = String(Number(m[2]) + 1).padStart(m[2].length, "0");
  return `${m[1]}${n}`;
}
