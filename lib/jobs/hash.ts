// Server-side hashing of signed content (node:crypto via lib/seal). Browser code imports ./content only.
import { contentHash } from "@/lib/seal";
import { stepContent, type StepContentInput } from "./content";

export function stepContentHash(input: StepContentInput): { content: Record<string, unknown>; hash: string } {
  const content = stepContent(input);
  return { content, hash: contentHash(content) };
}

export { contentHash };
