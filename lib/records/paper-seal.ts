// The seal printed on a traveller (and carried in its QR as ?seal=) against the record in the database.
// A database rewritten after printing recomputes to a new seal, which the paper in the customer's hands
// does not carry. Pure, so the API, the verify page and the tests agree on the words.

/** The QR and a typed check carry at least this many leading hex digits of the 64-digit seal. */
export const PAPER_SEAL_MIN = 16;

/** The leading hex digits of a seal as printed: spaces and case do not matter; null when it is not one. */
export function normalisePaperSeal(text: string): string | null {
  const hex = text.replace(/[\s:-]+/g, "").toLowerCase();
  return /^[0-9a-f]+$/.test(hex) && hex.length >= PAPER_SEAL_MIN && hex.length <= 64 ? hex : null;
}

/** The traveller's verify URL with the leading digits of its seal, as the QR encodes it. */
export function verifyUrlWithSeal(verifyUrl: string, seal: string): string {
  const url = new URL(verifyUrl);
  url.searchParams.set("seal", seal.slice(0, PAPER_SEAL_MIN));
  return url.toString();
}

type PaperVerdict = "agrees" | "earlier" | "disagrees";

export type PaperCheck = {
  /** the digits given, as compared */
  seal: string;
  verdict: PaperVerdict;
  /** true only when the record is intact and its seal begins with the paper's digits */
  agrees: boolean;
  /** for an earlier print of an open job: how many entries the record had when it was printed */
  printedAtEntries: number | null;
  message: string;
};

export function comparePaperSeal(paper: string, record: { intact: boolean; seal: string | null; entryHashes: readonly string[] }): PaperCheck {
  const base = { seal: paper, printedAtEntries: null };
  const entries = record.entryHashes.length;
  if (record.intact && record.seal?.startsWith(paper)) {
    return { ...base, verdict: "agrees", agrees: true, message: `The paper and the record agree: the seal printed on the traveller is the seal of all ${entries} signed entries.` };
  }
  const earlier = record.intact ? record.entryHashes.findIndex((h, i) => i < entries - 1 && h.startsWith(paper)) : -1;
  if (earlier >= 0) {
    return {
      ...base,
      verdict: "earlier",
      agrees: false,
      printedAtEntries: earlier + 1,
      message: `This paper was printed when the record had ${earlier + 1} of its ${entries} entries: the record has grown since. Print the traveller again for the current seal.`,
    };
  }
  if (!record.intact) {
    return {
      ...base,
      verdict: "disagrees",
      agrees: false,
      message: "The paper and the record disagree: the record in the database no longer hashes to the seal printed on the paper. Trust neither until the shop explains it; keep the paper.",
    };
  }
  return {
    ...base,
    verdict: "disagrees",
    agrees: false,
    message: "The paper and the record disagree: the seal printed on the traveller is not the seal of the record in the database. The record may have been rewritten after printing; keep the paper and ask the shop.",
  };
}

/** The seal a scanned traveller URL carries (?seal=), or null. */
export function sealFromScan(text: string): string | null {
  const m = /[?&]seal=([0-9a-fA-F]+)/.exec(text);
  return m ? normalisePaperSeal(m[1]!) : null;
}

/** Where a scan or a typed code leads: the verify page, with the paper's seal when there is one. */
export function verifyPath(token: string, seal: string | null): string {
  return seal ? `/verify/${token}?seal=${seal}` : `/verify/${token}`;
}
