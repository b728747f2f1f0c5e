/** One line of the benchmark report. `target` and `pass` are absent for figures without a target. */
export interface BenchRow {
  name: string;
  value: number;
  unit: string;
  /** human text of the target, for example "<= 50 µs" */
  target?: string;
  pass?: boolean;
}

/**
 * Times `fn` over enough runs to fill about `budgetMs`, after a warm-up; returns the median of
 * five rounds' means in microseconds, so that a burst of other work on a shared machine moves
 * one round, not the figure.
 */
export function timeMicros(fn: () => unknown, budgetMs = 400): number {
  for (let i = 0; i < 50; i++) fn();
  const ROUNDS = 5;
  const means: number[] = [];
  const budget = BigInt(Math.ceil((budgetMs / ROUNDS) * 1_000_000));
  for (let r = 0; r < ROUNDS; r++) {
    let runs = 0;
    const start = process.hrtime.bigint();
    let elapsed = 0n;
    while (elapsed < budget) {
      fn();
      runs++;
      elapsed = process.hrtime.bigint() - start;
    }
    means.push(Number(elapsed) / 1000 / runs);
  }
  return means.sort((a, b) => a - b)[Math.floor(ROUNDS / 2)];
}
