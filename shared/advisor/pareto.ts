// The Pareto front on price (lower is better), mass (lower) and attenuation (higher): a design
// is on it when no other design is at least as good on all three and better on one.

export interface Scored {
  unitPrice_cents: number;
  mass_kg: number;
  attenuation_db: number;
}

export function dominates(a: Scored, b: Scored): boolean {
  return (
    a.unitPrice_cents <= b.unitPrice_cents &&
    a.mass_kg <= b.mass_kg &&
    a.attenuation_db >= b.attenuation_db &&
    (a.unitPrice_cents < b.unitPrice_cents || a.mass_kg < b.mass_kg || a.attenuation_db > b.attenuation_db)
  );
}

/** Cheapest first, then lighter, then stronger: every design that dominates another sorts before it. */
export function byPrice(a: Scored, b: Scored): number {
  return a.unitPrice_cents - b.unitPrice_cents || a.mass_kg - b.mass_kg || b.attenuation_db - a.attenuation_db;
}

/**
 * Which of `sorted` (in byPrice order) are on the front. One pass: a design is dominated only by
 * designs before it, and when by any, then by one already on the front (dominance is transitive).
 */
export function frontFlags(sorted: readonly Scored[]): boolean[] {
  const front: Scored[] = [];
  return sorted.map((x) => {
    if (front.some((y) => dominates(y, x))) return false;
    front.push(x);
    return true;
  });
}

/** The non-dominated designs seen so far, for the search's pruning test. */
export class RunningFront {
  private members: Scored[] = [];

  add(x: Scored): void {
    if (this.members.some((y) => dominates(y, x) || (y.unitPrice_cents === x.unitPrice_cents && y.mass_kg === x.mass_kg && y.attenuation_db === x.attenuation_db))) return;
    this.members = this.members.filter((y) => !dominates(x, y));
    this.members.push(x);
  }

  /**
   * The lowest price of a design seen so far that is no heavier than `mass_kg` and at least
   * `attenuation_db` (+∞ when none is): a design of that mass and attenuation priced above it is
   * dominated. The front alone is enough: any design seen is matched or beaten on all three by
   * a front member.
   */
  cheapestAsGood(mass_kg: number, attenuation_db: number): number {
    let best = Infinity;
    for (const y of this.members) if (y.mass_kg <= mass_kg && y.attenuation_db >= attenuation_db && y.unitPrice_cents < best) best = y.unitPrice_cents;
    return best;
  }

  /**
   * Whether a design seen so far is no heavier than `mass_kg`, at least `attenuation_db` and
   * priced below `price_cents` (cheapestAsGood(mass_kg, attenuation_db) < price_cents, without
   * looking further once one is found).
   */
  anyAsGoodBelow(mass_kg: number, attenuation_db: number, price_cents: number): boolean {
    for (const y of this.members) if (y.unitPrice_cents < price_cents && y.mass_kg <= mass_kg && y.attenuation_db >= attenuation_db) return true;
    return false;
  }

  get size(): number {
    return this.members.length;
  }
}
