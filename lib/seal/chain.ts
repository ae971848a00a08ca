/** The record chain with node:crypto's SHA-256 plugged in (server-side). */
import { canonicalJson } from "./canonical-json";
import {
  type ChainRow,
  type ChainVerification,
  type VerifyOptions,
  GENESIS_HASH,
  buildChainRowsWith,
  buildChainWith,
  chainHashWith,
  verifyChainWith,
} from "./chain-core";
import { sha256Hex } from "./sha256";

/** SHA-256 hex of (prevHash ‖ canonical JSON of entry). */
export function chainHash(prevHash: string, entry: unknown): string {
  return chainHashWith(sha256Hex, prevHash, entry);
}

/** Hashes of consecutive entries, the first chained to GENESIS_HASH (or to `prevHash`). */
export function buildChain(entries: readonly unknown[], prevHash: string = GENESIS_HASH): string[] {
  return buildChainWith(sha256Hex, entries, prevHash);
}

/** Rows ready to store, seq counted from `firstSeq` (default 1). */
export function buildChainRows<E>(entries: readonly E[], firstSeq = 1): ChainRow<E>[] {
  return buildChainRowsWith(sha256Hex, entries, firstSeq);
}

export function verifyChain(rows: readonly ChainRow[], options?: VerifyOptions): ChainVerification {
  return verifyChainWith(sha256Hex, rows, options);
}

/** SHA-256 hex of the canonical JSON of a value: step content hashes, procedure version hashes. */
export function contentHash(value: unknown): string {
  return sha256Hex(canonicalJson(value));
}
