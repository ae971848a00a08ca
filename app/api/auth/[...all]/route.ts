import { authRoute } from "@/lib/api/route";
import { getAuth } from "@/lib/auth";

// better-auth answers everything under /api/auth (sign-in, sign-out, session).
export const dynamic = "force-dynamic";
export const GET = authRoute((req) => getAuth(req.headers).handler(req));
export const POST = authRoute((req) => getAuth(req.headers).handler(req));
