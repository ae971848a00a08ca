import { procedureImageForServing } from "@/db/queries/procedure-images";
import { shopRoute } from "@/lib/api/route";
import { idParam } from "../../jobs/_lib/params";

export const dynamic = "force-dynamic";

// GET /api/procedure-images/{id}?size=thumb|full → the stored JPEG, to members of the image's shop only.
export const GET = shopRoute({ action: "procedure:read" }, async ({ ctx, params, query }) => {
  const size = query.get("size") === "thumb" ? "thumb" : "full";
  const img = await procedureImageForServing(ctx.shopId, idParam(params, "id", "Image"), size);
  return new Response(new Uint8Array(img.bytes), {
    status: 200,
    headers: {
      "Content-Type": img.contentType,
      "Content-Length": String(img.bytes.length),
      "Cache-Control": "private, max-age=31536000, immutable",
      ETag: `"${size}-${img.sha256.slice(0, 32)}"`,
    },
  });
});
