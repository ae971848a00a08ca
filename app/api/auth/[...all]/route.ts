import { getAuth } from "@/lib/auth";

// better-auth answers everything under /api/auth (sign-in, sign-out, session).
export const dynamic = "force-dynamic";
export const GET = (req: Request) => getAuth(req.headers).handler(req);
export const POST = (req: Request) => getAuth(req.headers).handler(req);
