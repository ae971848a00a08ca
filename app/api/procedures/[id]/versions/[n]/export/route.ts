import { NextResponse } from "next/server";
import { getVersion } from "@/db/queries/procedures";
import { shopRoute } from "@/lib/api/route";
import { env } from "@/lib/env";
import { procedureImageBytes } from "@/db/queries/procedure-images";
import { AppError } from "@/lib/errors";
import { fileNameFor, PROCEDURE_FILE_SCHEMA_PATH, PROCEDURE_FILE_V1_SCHEMA_PATH, toProcedureFile } from "@/lib/procedures/file";
import { procedureIdFrom, versionNumberFrom } from "../../../../_lib/params";

export const dynamic = "force-dynamic";

// The map's images travel in the file as stored (the bytes its SHA-256 names), base64.
async function mapImages(shopId: string, ids: string[]) {
  const bytes = await procedureImageBytes(shopId, ids);
  return ids.map((id) => {
    const b = bytes.get(id);
    if (!b) throw new AppError("unavailable", "An image of this version's weld map is missing from the store; the file cannot be complete.");
    return { id, contentType: b.contentType === "image/png" ? ("image/png" as const) : ("image/jpeg" as const), data: b.bytes.toString("base64") };
  });
}

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
    `${env().APP_URL.replace(/\/$/, "")}${v.content.weldMap ? PROCEDURE_FILE_SCHEMA_PATH : PROCEDURE_FILE_V1_SCHEMA_PATH}`,
    await mapImages(ctx.shopId, v.content.weldMap?.images.map((i) => i.id) ?? []),
  );
  return new NextResponse(`${JSON.stringify(file, null, 2)}\n`, {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="${fileNameFor(v.title, v.number)}"`,
      "cache-control": "no-store",
    },
  });
});
