import { photoForServing } from "@/db/queries/jobs-photos";
import { shopRoute } from "@/lib/api/route";
import { idParam } from "../../jobs/_lib/params";

export const dynamic = "force-dynamic";

// GET /api/photos/{id}?size=thumb|full → the stored JPEG, to members of the photo's shop only (others: 404).
export const GET = shopRoute({ action: "job:read" }, async ({ ctx, params, query }) => {
  const size = query.get("size") === "thumb" ? "thumb" : "full";
  const photo = await photoForServing(ctx.shopId, idParam(params, "id", "Photo"), size);
  return new Response(new Uint8Array(photo.bytes), {
    status: 200,
    headers: {
      "Content-Type": photo.contentType,
      "Content-Length": String(photo.bytes.length),
      // Stored photos never change; private so shared caches never keep one shop's photo for another.
      "Cache-Control": "private, max-age=31536000, immutable",
      "Content-Disposition": `inline; filename="${photo.name}"`,
      ETag: `"${size}-${photo.sha256.slice(0, 32)}"`,
    },
  });
});
