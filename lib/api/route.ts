import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { authorize, type Action } from "@/lib/authz";
import { SHOP_COOKIE, sessionFromHeaders, shopContextFor, type ShopContext } from "@/lib/auth/context";
import { isJsonMediaType, parseUntrustedJson, readBodyBytes, readJson } from "@/lib/api/body";
import { controlCharacterIn, controlCharacterMessage } from "@/lib/text-safety";
import { assertSameOrigin } from "@/lib/api/origin";
import { AppError, DATABASE_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from "@/lib/errors";

export { MAX_JSON_BYTES, readJson } from "@/lib/api/body";

function zodFields(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

// The one place an error becomes an answer: refusals keep their status and reason; a database that cannot
// be reached is a 503 to retry, never a 500; anything else is logged and answered without details.
export function errorResponse(error: unknown): NextResponse {
  if (error instanceof AppError) {
    const headers = error.status === 503 ? { "Retry-After": String(DATABASE_RETRY_AFTER_SECONDS) } : undefined;
    return NextResponse.json(error.toJSON(), { status: error.status, headers });
  }
  if (error instanceof z.ZodError) {
    return NextResponse.json(
      { error: { code: "bad_request", message: "Some fields are not valid.", fields: zodFields(error) } },
      { status: 400 },
    );
  }
  if (isDatabaseUnavailable(error)) {
    console.error("[api] database unavailable", error instanceof Error ? error.message : error);
    return NextResponse.json(
      { error: { code: "unavailable", message: "The database cannot be reached right now; nothing was saved. Try again in a moment." } },
      { status: 503, headers: { "Retry-After": String(DATABASE_RETRY_AFTER_SECONDS) } },
    );
  }
  console.error("[api] unexpected error", error);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on our side; nothing was saved." } }, { status: 500 });
}

type Params = Record<string, string | string[] | undefined>;

type Handler<B, C> = (args: { req: NextRequest; body: B; params: Params; ctx: C; query: URLSearchParams }) => Promise<Response | unknown>;

// `preferShopId` picks that shop when the person belongs to it (a record's own shop, say).
async function principalFor(req: NextRequest, preferShopId?: string): Promise<ShopContext | null> {
  const user = await sessionFromHeaders(req.headers);
  if (!user) return null;
  const wanted = preferShopId ?? req.headers.get("x-gusset-shop") ?? req.cookies.get(SHOP_COOKIE)?.value;
  return shopContextFor(user, wanted ?? undefined);
}

// Query text reaches SQL (searches) and screens like body text does.
function assertCleanQuery(query: URLSearchParams) {
  const fields: Record<string, string[]> = {};
  for (const [name, value] of query) {
    const code = controlCharacterIn(value) ?? controlCharacterIn(name);
    if (code) (fields[name] ??= []).push(controlCharacterMessage(code));
  }
  if (Object.keys(fields).length) throw new AppError("bad_request", "The address holds an invisible control character.", fields);
}

function wrap(run: (req: NextRequest, params: Params) => Promise<Response | unknown>) {
  return async (req: NextRequest, route: { params: Promise<Params> }) => {
    try {
      assertSameOrigin(req);
      assertCleanQuery(req.nextUrl.searchParams);
      const result = await run(req, (await route?.params) ?? {});
      return result instanceof Response ? result : NextResponse.json(result);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

// A handler for members of a shop: session, shop, role, then a parsed body. Deny by default.
export function shopRoute<S extends z.ZodType | undefined = undefined>(
  opts: { action: Action; body?: S },
  handler: Handler<S extends z.ZodType ? z.output<S> : undefined, ShopContext>,
) {
  return wrap(async (req, params) => {
    const ctx = await principalFor(req);
    authorize(ctx, opts.action);
    const body = opts.body ? opts.body.parse(await readJson(req)) : undefined;
    return handler({ req, params, ctx: ctx as ShopContext, body: body as never, query: req.nextUrl.searchParams });
  });
}

// A handler open to anyone (calculators, health, verify); it may still look at the session.
export function publicRoute<S extends z.ZodType | undefined = undefined>(
  opts: { body?: S },
  handler: Handler<S extends z.ZodType ? z.output<S> : undefined, { principal: (preferShopId?: string) => Promise<ShopContext | null> }>,
) {
  return wrap(async (req, params) => {
    const body = opts.body ? opts.body.parse(await readJson(req)) : undefined;
    return handler({ req, params, body: body as never, ctx: { principal: (preferShopId?: string) => principalFor(req, preferShopId) }, query: req.nextUrl.searchParams });
  });
}

// better-auth reads its own bodies (sign-in, sign-out, password change); they are small. The body is read
// here first under the same streaming limit and text rules, then handed on. better-auth checks Origin itself
// against its trusted origins.
const AUTH_MAX_BYTES = 64 * 1024;

export function authRoute(handler: (req: Request) => Promise<Response>) {
  return async (req: Request): Promise<Response> => {
    try {
      if (req.method === "GET" || req.method === "HEAD") return await handler(req);
      const bytes = await readBodyBytes(req, AUTH_MAX_BYTES);
      if (bytes.byteLength && isJsonMediaType((req.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase())) {
        parseUntrustedJson(new TextDecoder("utf-8").decode(bytes));
      }
      const headers = new Headers(req.headers);
      headers.delete("content-length");
      headers.delete("transfer-encoding");
      return await handler(new Request(req.url, { method: req.method, headers, body: bytes.byteLength ? bytes : undefined }));
    } catch (error) {
      return errorResponse(error);
    }
  };
}
