import { NextResponse } from "next/server";
import { acceptInvitation } from "@/db/queries/people";
import { publicRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { acceptInviteApiSchema } from "@/lib/schemas/people";

export const dynamic = "force-dynamic";

// Holding the invitation's token is the permission; it works once.
export const POST = publicRoute({ body: acceptInviteApiSchema }, async ({ params, body }) => {
  const token = typeof params.token === "string" ? params.token : "";
  if (token.length < 10 || token.length > 100) throw new AppError("not_found", "This invitation is not valid.");
  const { shopId } = await acceptInvitation({ token, name: body.name, password: body.password });
  return NextResponse.json({ joined: { shopId } }, { status: 201 });
});
