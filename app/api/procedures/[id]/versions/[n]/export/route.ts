import { NextResponse } from "next/server";
import { getVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { env } from "@/lib/env";
import { fileNameFor, PROCEDURE_FILE_SCHEMA_PATH, toProcedureFile } from "@/lib/procedures/file";
import { procedureIdFrom, versionNumberFrom } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, params }) => {
  const procedureId = procedureIdFrom(params);
  const v = await getVersion(ctx.shopId, procedureId, versionNumberFrom(params));
  const file = toProcedureFile(
    v,
    {
      shop: ctx.shop.name,
      procedureId,
      version: v.number,
      status: v.status,
      ...(v.contentHash ? { contentHash: v.contentHash } : {}),
      ...(v.changeNote ? { changeNote: v.changeNote } : {}),
      ...(v.publishedAt ? { publishedAt: v.publishedAt.toISOString() } : {}),
      exportedAt: new Date().toISOString(),
    },
    `${env().APP_URL.replace(/\/$/, "")}${PROCEDURE_FILE_SCHEMA_PATH}`,
  );
  return new NextResponse(`${JSON.stringify(file, null, 2)}\n`, {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${fileNameFor(v.title, v.number)}"`,
      "cache-control": "no-store",
    },
  });
});
