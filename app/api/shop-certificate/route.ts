import { z } from "zod";
import { publicRoute } from "@/lib/api/route";
import { AppError } from "@/lib/errors";
import { shopAuthority } from "@/lib/net/shop-certificate";

const query = z.object({ format: z.enum(["der", "pem"]).default("der") });

// Anyone may fetch it: a tablet needs it before anyone signs in, and a certificate is public by nature.
export const GET = publicRoute({}, async ({ query: q }) => {
  const parsed = query.safeParse({ format: q.get("format") ?? undefined });
  if (!parsed.success) throw new AppError("bad_request", "format must be der or pem.");
  const ca = shopAuthority();
  if (!ca) throw new AppError("not_found", "This Gusset has no shop certificate: it is served through a proxy with a certificate of its own.");
  const pem = parsed.data.format === "pem";
  return new Response(pem ? ca.pem : new Uint8Array(ca.der), {
    headers: {
      "content-type": pem ? "application/x-pem-file" : "application/x-x509-ca-cert",
      "content-disposition": `attachment; filename="gusset-shop-certificate.${pem ? "pem" : "crt"}"`,
      "cache-control": "no-store",
    },
  });
});
