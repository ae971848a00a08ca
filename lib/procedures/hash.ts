// A version's seal: SHA-256 of the RFC 8785 canonical JSON of what a signer follows.
import { contentHash } from "@/lib/seal";
import type { VersionContent } from "./schema";

export type VersionBody = { title: string; scope: string; code: string; content: VersionContent };

// The hash covers the title, scope and code as well as the steps: a job pinned to a version must be able to
// show years later that nothing it was done against has changed, including what the procedure said it followed.
export function versionHash(v: VersionBody): string {
  return contentHash({ title: v.title, scope: v.scope, code: v.code, content: v.content });
}
