import { NextResponse } from "next/server";
import { listOpenInvitations } from "@/db/queries/people";
import { shopRoute } from "@/lib/api/route";
import { inviteAndMail } from "@/lib/people/invite";
import { inviteSchema } from "@/lib/schemas/auth";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "people:read" }, async ({ ctx }) => ({ invitations: await listOpenInvitations(ctx.shopId) }));

export const POST = shopRoute({ action: "people:manage", body: inviteSchema }, async ({ ctx, body }) => {
  const result = await inviteAndMail(ctx, body.email, body.roles);
  return NextResponse.json({ invitation: result }, { status: 201 });
});
