"use server";
import { parseWithZod } from "@conform-to/zod/v4";
import { acceptInvitation } from "@/db/queries/people";
import type { FormState } from "@/lib/api/action";
import { formControlCharacterFields } from "@/lib/api/body";
import { getSessionUser } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";
import { acceptInviteSchema } from "@/lib/schemas/auth";

// Open to signed-out visitors on purpose: holding the invitation's token is the permission.
export async function acceptInvite(_: FormState | undefined, formData: FormData): Promise<FormState> {
  const submission = parseWithZod(formData, { schema: acceptInviteSchema });
  const control = formControlCharacterFields(formData);
  if (control) return submission.reply({ formErrors: ["Some text holds an invisible control character; nothing was saved."], fieldErrors: control });
  if (submission.status !== "success") return submission.reply();
  try {
    const me = await getSessionUser();
    await acceptInvitation({ token: submission.value.token, name: submission.value.name, password: submission.value.password, signedInUserId: me?.id });
    return { ...submission.reply({ resetForm: true }), ok: "Welcome aboard. Sign in with your e-mail and new password." };
  } catch (error) {
    if (error instanceof AppError) return submission.reply({ formErrors: [error.message] });
    console.error("[invite] unexpected error", error);
    return submission.reply({ formErrors: ["Something went wrong on our side; nothing was saved."] });
  }
}
