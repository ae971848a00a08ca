import "server-only";
import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { authorize, type Action } from "@/lib/authz";
import { SHOP_COOKIE, sessionFromHeaders, shopContextFor, type ShopContext } from "@/lib/auth/context";
import { AppError } from "@/lib/errors";

export const MAX_JSON_BYTES = 1024 * 1024;

export function zodFields(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

export function errorResponse(error: unknown): NextResponse {
  if (error instanceof AppError) return NextResponse.json(error.toJSON(), { status: error.status });
  if (error instanceof z.ZodError) {
    return NextResponse.json(
      { error: { code: "bad_request", message: "Some fields are not valid.", fields: zodFields(error) } },
      { status: 400 },
    );
  }
  console.error("[api] unexpected error", error);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on our side; nothing was saved." } }, { status: 500 });
}

export async function readJson(req: Request, maxBytes = MAX_JSON_BYTES): Promise<unknown> {
  const length = Number(req.headers.get("content-length") ?? "0");
  if (length > maxBytes) throw new AppError("payload_too_large", `The request is larger than ${Math.round(maxBytes / 1024)} KB.`);
  const text = await req.text();
  if (text.length > maxBytes) throw new AppError("payload_too_large", `The request is larger than ${Math.round(maxBytes / 1024)} KB.`);
  if (!text.trim()) throw new AppError("bad_request", "The request has no JSON body.");
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError("bad_request", "The request body is not valid JSON.");
  }
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

function wrap(run: (req: NextRequest, params: Params) => Promise<Response | unknown>) {
  return async (req: NextRequest, route: { params: Promise<Params> }) => {
    try {
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
