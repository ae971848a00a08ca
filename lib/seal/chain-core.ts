/**
 * The record chain without a hash implementation, so a browser can verify a traveller with any
 * synchronous SHA-256 it has. Node code uses ./chain, which plugs in node:crypto.
 *
 * hash(n) = SHA-256 hex of ( hash(n−1) as 64 lower-case hex characters ‖ canonical JSON of entry n ),
 * with hash(0), the genesis value, defined as 64 zeros (no entry precedes the first).
 */
import { canonicalJson } from "./canonical-json";

export const GENESIS_HASH = "0".repeat(64);

export type HashFn = (text: string) => string;

const HEX64 = /^[0-9a-f]{64}$/;

export function isHash(value: unknown): value is string {
  return typeof value === "string" && HEX64.test(value);
}

/** The exact text that is hashed for an entry. */
export function chainPreimage(prevHash: string, entry: unknown): string {
  if (!isHash(prevHash)) throw new TypeError("prevHash must be 64 lower-case hex characters");
  return prevHash + canonicalJson(entry);
}

export function chainHashWith(hash: HashFn, prevHash: string, entry: unknown): string {
  return hash(chainPreimage(prevHash, entry));
}

export function buildChainWith(hash: HashFn, entries: readonly unknown[], prevHash: string = GENESIS_HASH): string[] {
  const hashes: string[] = [];
  let prev = prevHash;
  for (const entry of entries) {
    prev = chainHashWith(hash, prev, entry);
    hashes.push(prev);
  }
  return hashes;
}

export interface ChainRow<E = unknown> {
  seq: number;
  prevHash: string;
  hash: string;
  entry: E;
}

export interface ChainVerification {
  intact: boolean;
  /** rows examined */
  entries: number;
  /** head hash when intact and not empty; null otherwise */
  seal: string | null;
  /** seq of the first row whose seq, prevHash or hash does not match the recomputed chain */
  firstBrokenSeq?: number;
  reason?: string;
}

export interface VerifyOptions {
  /** seq of the first row; defaults to 1 */
  firstSeq?: number;
  /**
   * The seal printed on the traveller. A chain can only prove what is still in it: without this,
   * cutting entries off the end (or rebuilding the chain from some entry on) goes unnoticed.
   */
  expectedSeal?: string;
  /** entry count printed with the seal */
  expectedEntries?: number;
}

export function buildChainRowsWith<E>(hash: HashFn, entries: readonly E[], firstSeq = 1): ChainRow<E>[] {
  const hashes = buildChainWith(hash, entries);
  return entries.map((entry, i) => ({
    seq: firstSeq + i,
    prevHash: i === 0 ? GENESIS_HASH : (hashes[i - 1] as string),
    hash: hashes[i] as string,
    entry,
  }));
}

/**
 * Walk rows in the order given (callers pass them ordered by seq, as stored) and recompute each
 * hash from the previous recomputed hash and the entry. Stops at the first break, since every
 * later hash depends on it. Never throws.
 */
export function verifyChainWith(hash: HashFn, rows: readonly ChainRow[], options: VerifyOptions = {}): ChainVerification {
  const firstSeq = options.firstSeq ?? 1;
  let prev = GENESIS_HASH;
  const broken = (seq: number, reason: string): ChainVerification => ({
    intact: false,
    entries: rows.length,
    seal: null,
    firstBrokenSeq: seq,
    reason,
  });

  for (let i = 0; i < rows.length; i++) {
    const row = rows[i] as ChainRow;
    const expectedSeq = firstSeq + i;
    if (row.seq !== expectedSeq) {
      const what = row.seq > expectedSeq ? "missing (deleted?)" : "out of order or duplicated";
      return broken(row.seq, `expected seq ${expectedSeq} but found ${row.seq}: entries ${what}`);
    }
    if (row.prevHash !== prev) {
      return broken(row.seq, `stored previous hash does not match the hash of the entry before it`);
    }
    let recomputed: string;
    try {
      recomputed = chainHashWith(hash, prev, row.entry);
    } catch (err) {
      return broken(row.seq, `entry cannot be canonicalised: ${err instanceof Error ? err.message : String(err)}`);
    }
    if (row.hash !== recomputed) {
      return broken(row.seq, "stored hash does not match the entry: the entry or its hash was changed");
    }
    prev = recomputed;
  }

  const seal = rows.length > 0 ? prev : null;
  if (options.expectedEntries !== undefined && options.expectedEntries !== rows.length) {
    return {
      intact: false,
      entries: rows.length,
      seal: null,
      reason: `the seal covers ${options.expectedEntries} entries but ${rows.length} are present`,
    };
  }
  if (options.expectedSeal !== undefined && options.expectedSeal !== (seal ?? GENESIS_HASH)) {
    return {
      intact: false,
      entries: rows.length,
      seal: null,
      reason: "the chain is consistent but its head does not match the expected seal",
    };
  }
  return { intact: true, entries: rows.length, seal };
}
