// The certificate digest: SHA-256 of a canonical text of the certified content, so that anyone can
// recompute it from the content the verification page shows (DEVELOPERS.md, "Certificate digest").
//
// The canonical form is JSON with these rules, and nothing else:
//   - objects: keys sorted by UTF-16 code units (JavaScript's default string order), no whitespace,
//     keys whose value is undefined left out;
//   - arrays: in their order; undefined is not allowed in them;
//   - strings: as JSON.stringify writes them (RFC 8259 escapes);
//   - true, false, null as themselves;
//   - numbers: every number, integer or not, written with 10 significant digits in exponent form,
//     as JavaScript's Number.prototype.toExponential(9) writes it: 52.3 → "5.230000000e+1",
//     125 → "1.250000000e+2", 0 and -0 → "0.000000000e+0". The fixed width hides floating-point
//     noise (39.99999999999999 and 40 give the same text); figures that must stay exact beyond
//     10 digits (identifiers, lot numbers) are strings.
//   - anything else (NaN, Infinity, dates, functions, class instances) is refused: convert first.
// The canonical text is hashed as UTF-8; the digest is 64 lower-case hex digits.

import { sha256 } from "@noble/hashes/sha2";
import { bytesToHex, utf8ToBytes } from "@noble/hashes/utils";

export type CanonicalValue = null | boolean | number | string | CanonicalValue[] | { [key: string]: CanonicalValue | undefined };

export function canonicalNumber(value: number): string {
  if (!Number.isFinite(value)) throw new TypeError(`the canonical form has no ${value}`);
  return (value === 0 ? 0 : value).toExponential(9);
}

export function canonicalize(value: CanonicalValue): string {
  if (value === null) return "null";
  switch (typeof value) {
    case "boolean":
      return value ? "true" : "false";
    case "number":
      return canonicalNumber(value);
    case "string":
      return JSON.stringify(value);
    case "object": {
      if (Array.isArray(value)) {
        return `[${value
          .map((item) => {
            if (item === undefined) throw new TypeError("the canonical form has no undefined array items");
            return canonicalize(item);
          })
          .join(",")}]`;
      }
      if (Object.getPrototypeOf(value) !== Object.prototype && Object.getPrototypeOf(value) !== null) {
        throw new TypeError("the canonical form takes plain objects only (convert dates to ISO strings first)");
      }
      const keys = Object.keys(value).filter((k) => value[k] !== undefined).sort();
      return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalize(value[k] as CanonicalValue)}`).join(",")}}`;
    }
    default:
      throw new TypeError(`the canonical form has no ${typeof value}`);
  }
}

export function sha256Hex(text: string): string {
  return bytesToHex(sha256(utf8ToBytes(text)));
}

/** The certificate digest: SHA-256 (hex) of the canonical text of the content. */
export function certificateDigest(content: CanonicalValue): string {
  return sha256Hex(canonicalize(content));
}

export const DIGEST_PATTERN = /^[0-9a-f]{64}$/;
