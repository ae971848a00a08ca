import "server-only";
import type { SubmissionResult } from "@conform-to/react";
import { parseWithZod } from "@conform-to/zod/v4";
import type { z } from "zod";
import type { Action } from "@/lib/authz";
import { authorizeShop, type ShopContext } from "@/lib/auth/context";
import { formControlCharacterFields } from "@/lib/api/body";
import { AppError, isDatabaseUnavailable } from "@/lib/errors";

export type FormState = SubmissionResult<string[]> & { ok?: string };

// Every server action that changes data goes through here: parse, session, shop, role, then run.
export async function runFormAction<S extends z.ZodType>(
  formData: FormData,
  opts: { schema: S; action: Action },
  run: (value: z.output<S>, ctx: ShopContext) => Promise<string | void>,
): Promise<FormState> {
  const submission = parseWithZod(formData, { schema: opts.schema });
  // Checked on the raw fields, so it holds whatever the schema trims or coerces.
  const control = formControlCharacterFields(formData);
  if (control) return submission.reply({ formErrors: ["Some text holds an invisible control character; nothing was saved."], fieldErrors: control });
  if (submission.status !== "success") return submission.reply();
  try {
    const ctx = await authorizeShop(opts.action);
    const ok = await run(submission.value as z.output<S>, ctx);
    return { ...submission.reply({ resetForm: true }), ok: ok ?? "Saved." };
  } catch (error) {
    if (error instanceof AppError) {
      return submission.reply({ formErrors: [error.message], fieldErrors: error.fields });
    }
    if (isDatabaseUnavailable(error)) {
      console.error("[action] database unavailable", error instanceof Error ? error.message : error);
      return submission.reply({ formErrors: ["The database cannot be reached right now; nothing was saved. Try again in a moment."] });
    }
    console.error("[action] unexpected error", error);
    return submission.reply({ formErrors: ["Something went wrong on our side; nothing was saved."] });
  }
}
