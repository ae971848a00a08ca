// A procedure that runs others in order: their sections one after another, each title saying which part it is.
// Keys are kept as they are, so the parts must already use distinct keys (the starter templates use a prefix each).
import type { ProcedureFile } from "./file";
import type { VersionContent } from "./schema";

const COMBINED_SAFETY_NOTE =
  "This procedure supports, and never replaces, the vehicle maker's specifications, local codes and qualified or licensed practice.";

export function combineProcedures(
  title: string,
  code: string,
  parts: readonly ProcedureFile[],
): { title: string; scope: string; code: string; content: VersionContent } {
  const list = parts.map((p, i) => `${i + 1}. ${p.procedure.title}`).join("\n");
  return {
    title,
    scope: `The whole bracket job, running these procedures in order:\n\n${list}\n\n${COMBINED_SAFETY_NOTE}`,
    code,
    content: {
      sections: parts.flatMap((p, i) => p.content.sections.map((s) => ({ ...s, title: `Part ${i + 1} · ${s.title}` }))),
    },
  };
}
