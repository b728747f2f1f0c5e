/**
 * Gathers calls that arrive while earlier ones are being written and runs them as one statement:
 * under load many requests share one database round trip, while a lone call goes out at once.
 * `run` answers the items in their order; a failure fails every call of that batch.
 */
export function batched<I, O>(run: (items: I[]) => Promise<O[]>, opts: { maxBatch?: number; maxInFlight?: number } = {}): (item: I) => Promise<O> {
  const maxBatch = opts.maxBatch ?? 100;
  const maxInFlight = opts.maxInFlight ?? 2;
  let waiting: Array<{ item: I; resolve: (o: O) => void; reject: (e: unknown) => void }> = [];
  let inFlight = 0;
  let scheduled = false;

  const flush = () => {
    scheduled = false;
    while (waiting.length && inFlight < maxInFlight) {
      const batch = waiting.slice(0, maxBatch);
      waiting = waiting.slice(batch.length);
      inFlight++;
      run(batch.map((b) => b.item))
        .then(
          (out) => batch.forEach((b, i) => b.resolve(out[i])),
          (err) => batch.forEach((b) => b.reject(err)),
        )
        .finally(() => {
          inFlight--;
          if (waiting.length) flush();
        });
    }
  };

  return (item) =>
    new Promise<O>((resolve, reject) => {
      waiting.push({ item, resolve, reject });
      // the calls of this turn of the event loop go together; later ones wait for a free slot
      if (!scheduled && inFlight < maxInFlight) {
        scheduled = true;
        setImmediate(flush);
      }
    });
}
