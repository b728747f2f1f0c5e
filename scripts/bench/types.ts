/** One line of the benchmark report. `target` and `pass` are absent for figures without a target. */
export interface BenchRow {
  name: string;
  value: number;
  unit: string;
  /** human text of the target, for example "<= 50 µs" */
  target?: string;
  pass?: boolean;
}

/** Times `fn` over enough runs to fill about `budgetMs`, after a warm-up; returns the mean in microseconds. */
export function timeMicros(fn: () => unknown, budgetMs = 400): number {
  for (let i = 0; i < 50; i++) fn();
  let runs = 0;
  const start = process.hrtime.bigint();
  let elapsed = 0n;
  const budget = BigInt(budgetMs) * 1_000_000n;
  while (elapsed < budget) {
    fn();
    runs++;
    elapsed = process.hrtime.bigint() - start;
  }
  return Number(elapsed) / 1000 / runs;
}
