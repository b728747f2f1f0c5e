// Reference data held in this process so a public computation costs no database round trip.
// An edit invalidates it at once in every process (referenceData.ts: here directly, elsewhere by
// NOTIFY); refreshMs is the backstop for a signal lost with its connection (served from the old
// copy while the new one loads).

export interface ProcessCache<T> {
  /** the value; loads it on first use */
  get(): Promise<T> | T;
  /** after an edit (call once the transaction has committed) */
  invalidate(): void;
  /** the last loaded value without waiting, or null before the first load */
  snapshot(): T | null;
}

export function processCache<T>(load: () => Promise<T>, refreshMs = 30_000): ProcessCache<T> {
  let current: { value: T; loadedAt: number } | null = null;
  let loading: Promise<T> | null = null;
  let generation = 0;

  const reload = (): Promise<T> => {
    if (loading) return loading;
    const started = generation;
    const p: Promise<T> = load()
      .then((value) => {
        // an edit while this was loading makes it stale: keep it for this caller, not for the next
        if (started === generation) current = { value, loadedAt: Date.now() };
        return value;
      })
      .finally(() => {
        if (loading === p) loading = null;
      });
    return (loading = p);
  };

  return {
    get() {
      if (!current) return reload();
      if (Date.now() - current.loadedAt > refreshMs) void reload().catch(() => {});
      return current.value;
    },
    invalidate() {
      generation++;
      current = null;
      loading = null; // a load already under way read the old rows
    },
    snapshot: () => current?.value ?? null,
  };
}
