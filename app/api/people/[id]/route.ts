import { z } from "zod";
import { getMember, setActive, setLegalName, setRoles } from "@/db/queries/people";
import { shopRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { personPatchSchema } from "@/lib/schemas/people";

export const dynamic = "force-dynamic";

const idSchema = z.string().uuid();

function memberId(params: Record<string, unknown>) {
  const parsed = idSchema.safeParse(params.id);
  if (!parsed.success) throw new AppError("not_found", "Person not found in this shop.");
  return parsed.data;
}

export const GET = shopRoute({ action: "people:read" }, async ({ ctx, params }) => ({ person: await getMember(ctx.shopId, memberId(params)) }));

export const PATCH = shopRoute({ action: "people:manage", body: personPatchSchema }, async ({ ctx, params, body }) => {
  const id = memberId(params);
  if (body.legalName !== undefined) await setLegalName({ shopId: ctx.shopId, membershipId: id, legalName: body.legalName, actorId: ctx.userId });
  if (body.roles) await setRoles({ shopId: ctx.shopId, membershipId: id, roles: body.roles, actorId: ctx.userId });
  if (body.active !== undefined) await setActive({ shopId: ctx.shopId, membershipId: id, active: body.active, actorId: ctx.userId });
  return { person: await getMember(ctx.shopId, id) };
});
