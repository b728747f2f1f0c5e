import { useState, type FocusEvent, type ReactNode, type Ref } from "react";
import {
  centsFromAmount, fieldUnitLabels, fromCanonical, frequencyUnitLabels, lengthUnitLabels, readNumber, showAmount, showInUnit, toCanonical,
  unitSymbols, type FieldUnit, type FrequencyUnit, type LengthUnit, type QuantityKind, type QuantityUnits,
} from "../../../shared/units";
import { control, FieldShell } from "./field";

/**
 * How one quantity is typed: from what the person types (in their unit) to the canonical value
 * the form keeps (mm, µT, Hz, cents) and back. `key` changes with the unit, so the box re-shows
 * the same quantity in the new unit.
 */
export interface Scale {
  key: string;
  /** the unit as written after the number */
  symbol: string;
  /** the unit as read aloud in the label ("inches") */
  spoken: string;
  toCanonical(typed: number): number;
  show(canonical: number | null): string;
}

const SPOKEN: Record<string, string> = { mm: "millimetres", in: "inches", mil: "mil", uT: "microtesla", mT: "millitesla", G: "gauss", mG: "milligauss", "A/m": "amperes per metre", Oe: "oersted", Hz: "hertz", kHz: "kilohertz", T: "tesla", nT: "nanotesla", cm: "centimetres", m: "metres" };

export function quantityScale<K extends QuantityKind>(kind: K, unit: QuantityUnits[K]): Scale {
  return {
    key: `${kind}:${unit}`,
    symbol: unitSymbols[unit],
    spoken: SPOKEN[unit] ?? unitSymbols[unit],
    toCanonical: (typed) => toCanonical(kind, typed, unit),
    show: (canonical) => showInUnit(kind, canonical, unit),
  };
}

/** Money typed in currency units (12.50), kept in integer cents. */
export function moneyScale(currency: string): Scale {
  return {
    key: `money:${currency}`,
    symbol: currency,
    spoken: currency,
    toCanonical: (typed) => centsFromAmount(typed, currency),
    show: (cents) => showAmount(cents, currency),
  };
}

/** A plain number with no unit (a ratio, a count). */
export const plainScale: Scale = { key: "plain", symbol: "", spoken: "", toCanonical: (x) => x, show: (x) => (x === null || !Number.isFinite(x) ? "" : String(+x.toPrecision(12))) };

/** A fraction (0.7) typed as a percentage (70 %). */
export const percentOfOneScale: Scale = {
  key: "percent-of-one",
  symbol: "%",
  spoken: "per cent",
  toCanonical: (typed) => +(typed / 100).toPrecision(12),
  show: (x) => (x === null || !Number.isFinite(x) ? "" : String(+(x * 100).toPrecision(10))),
};

/** A plain number shown with a unit after it that is not converted (%, dB, a ratio's "×"). */
export function fixedUnitScale(symbol: string, spoken = symbol): Scale {
  return { ...plainScale, key: `fixed:${symbol}`, symbol, spoken };
}

/** A quantity typed in a convenient multiple of its canonical unit: resistivity typed in µΩ·m, kept in Ω·m (factor 1e-6). */
export function factorScale(symbol: string, factor: number, spoken = symbol): Scale {
  return {
    key: `factor:${symbol}:${factor}`,
    symbol,
    spoken,
    toCanonical: (typed) => +(typed * factor).toPrecision(12),
    show: (x) => (x === null || !Number.isFinite(x) ? "" : String(+(x / factor).toPrecision(10))),
  };
}

/** Options for a unit select next to the box. */
export const unitOptions = {
  length: (units: readonly LengthUnit[]) => units.map((u) => ({ value: u, label: u === "in" ? "in" : lengthUnitLabels[u] })),
  flux: (units: readonly FieldUnit[]) => units.map((u) => ({ value: u, label: fieldUnitLabels[u] })),
  frequency: (units: readonly FrequencyUnit[]) => units.map((u) => ({ value: u, label: frequencyUnitLabels[u] })),
};

const same = (a: number | null, b: number | null) =>
  a === b || (a !== null && b !== null && ((Number.isNaN(a) && Number.isNaN(b)) || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b))));

/** What the typed text means in canonical units: null when empty, NaN when unreadable. */
export function canonicalOf(text: string, scale: Scale): number | null {
  const typed = readNumber(text);
  return typed === null || Number.isNaN(typed) ? typed : scale.toCanonical(typed);
}

interface UnitInputProps {
  label: string;
  /** the canonical value (mm, µT, Hz, cents); null when empty, NaN when what was typed is not a number */
  value: number | null;
  onValueChange: (value: number | null) => void;
  scale: Scale;
  /** a unit select joined to the box; changing it re-shows the value, never changes it */
  unitSelect?: { value: string; options: Array<{ value: string; label: string }>; onChange: (unit: string) => void };
  /** after a change, when the person leaves the box: the moment an edit is "done" (history entries) */
  onCommit?: () => void;
  /** the box was left (react-hook-form's onBlur) */
  onBlur?: () => void;
  error?: string;
  hint?: ReactNode;
  hideLabel?: boolean;
  name?: string;
  /** the input element, for a form library that focuses the first field with a problem */
  inputRef?: Ref<HTMLInputElement>;
  inputMode?: "decimal" | "numeric";
  className?: string;
}

/**
 * The one input for every quantity a person types. The form keeps the canonical value; this box
 * keeps only the text being typed, so "2." or "1,5" survive the keystroke, and a unit switch (or
 * a value set from outside, say by the back button) re-shows the kept value in the unit now chosen.
 */
export function UnitInput({ label, value, onValueChange, scale, unitSelect, onCommit, onBlur, error, hint, hideLabel, name, inputRef, inputMode = "decimal", className = "" }: UnitInputProps) {
  const [text, setText] = useState(() => scale.show(value));
  const [shown, setShown] = useState({ key: scale.key, value });
  const [dirty, setDirty] = useState(false);
  if (shown.key !== scale.key || !same(shown.value, value)) {
    // the unit changed, or the value was set from outside: show the kept value afresh
    setShown({ key: scale.key, value });
    if (shown.key !== scale.key || !same(canonicalOf(text, scale), value)) setText(scale.show(value));
  }
  const change = (next: string) => {
    setText(next);
    setDirty(true);
    const v = canonicalOf(next, scale);
    setShown({ key: scale.key, value: v });
    onValueChange(v);
  };
  const blur = (_e: FocusEvent<HTMLInputElement>) => {
    onBlur?.();
    if (dirty) {
      setDirty(false);
      onCommit?.();
    }
  };
  const spokenUnit = scale.spoken ? <span className="sr-only">, in {scale.spoken}</span> : null;
  return (
    <FieldShell label={<>{label}{spokenUnit}</>} error={error} hint={hint} hideLabel={hideLabel}>
      {({ id, describedBy, invalid }) => (
        <div className="flex items-stretch">
          <input
            ref={inputRef}
            id={id}
            name={name}
            type="text"
            inputMode={inputMode}
            autoComplete="off"
            spellCheck={false}
            aria-invalid={invalid}
            aria-describedby={describedBy}
            className={`${control} min-w-0 flex-1 border-nickel-400 font-mono tabular ${scale.symbol || unitSelect ? "rounded-r-none" : ""} ${className}`}
            value={text}
            onChange={(e) => change(e.target.value)}
            onBlur={blur}
          />
          {unitSelect ? (
            <select
              aria-label={`Unit for ${label.toLowerCase()}`}
              className="min-h-touch shrink-0 rounded-r-md border border-l-0 border-nickel-400 bg-nickel-100 px-2 text-body text-flux-900"
              value={unitSelect.value}
              onChange={(e) => {
                unitSelect.onChange(e.target.value);
                onCommit?.();
              }}
            >
              {unitSelect.options.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </select>
          ) : scale.symbol ? (
            <span className="grid min-h-touch shrink-0 place-items-center rounded-r-md border border-l-0 border-nickel-400 bg-nickel-100 px-2.5 font-mono text-meta text-flux-700" aria-hidden="true">
              {scale.symbol}
            </span>
          ) : null}
        </div>
      )}
    </FieldShell>
  );
}

/** The figure in the person's unit for a sentence ("4.72441 in"), or "—". */
export function formatInUnit<K extends QuantityKind>(kind: K, canonical: number, unit: QuantityUnits[K], significant = 4): string {
  if (!Number.isFinite(canonical)) return "—";
  const v = fromCanonical(kind, canonical, unit);
  return `${+v.toPrecision(significant)} ${unitSymbols[unit]}`;
}
