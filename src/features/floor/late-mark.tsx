/** A small stamp for a late job or lot: a word, not only a colour. */
export function LateMark({ late }: { late: boolean }) {
  return late ? <span className="ml-2 inline-block rounded bg-danger-700 px-1.5 py-0.5 text-meta font-semibold text-white">Late</span> : null;
}
