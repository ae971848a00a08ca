import "server-only";
import { createInvitation } from "@/db/queries/people";
import { ROLE_LABELS, type Role } from "@/lib/authz";
import type { ShopContext } from "@/lib/auth/context";
import { env } from "@/lib/env";
import { mailHtml, sendMail } from "@/lib/mail";

// Records the invitation, then mails the link; a mail that fails is retried from the outbox.
export async function inviteAndMail(ctx: ShopContext, email: string, roles: Role[]) {
  const { token, expiresAt } = await createInvitation({ shopId: ctx.shopId, email, roles, invitedBy: ctx.userId });
  const url = `${env().APP_URL}/invite/${token}`;
  const lines = [
    `${ctx.user.name} invited you to ${ctx.shop.name} on Gusset as ${roles.map((r) => ROLE_LABELS[r]).join(", ")}.`,
    `Open the link to choose your password. It works until ${expiresAt.toISOString().slice(0, 10)}.`,
  ];
  const { sent } = await sendMail({
    shopId: ctx.shopId,
    to: email,
    subject: `You're invited to ${ctx.shop.name} on Gusset`,
    text: `${lines.join("\n\n")}\n\n${url}\n`,
    html: mailHtml(`Join ${ctx.shop.name}`, lines, { label: "Accept the invitation", url }),
  });
  return { email, expiresAt, sent };
}
