/**
 * RFC 8785 (JSON Canonicalization Scheme) text of a value, via the `canonicalize` package.
 * Pure JavaScript, no Node APIs: a browser can import this file to recompute hashes.
 */
import canonicalize from "canonicalize";

/**
 * Canonical JSON. Throws TypeError for values with no JSON form (undefined, functions) and for
 * what RFC 8785 forbids (NaN, ±Infinity, lone surrogates, cycles): a record that cannot be
 * canonicalised must not be sealed with a guessed serialisation.
 */
export function canonicalJson(value: unknown): string {
  let text: string | undefined;
  try {
    text = canonicalize(value);
  } catch (err) {
    throw new TypeError(`value cannot be canonicalised: ${err instanceof Error ? err.message : String(err)}`);
  }
  if (text === undefined) throw new TypeError("value has no JSON representation");
  return text;
}
