// Cross-site request forgery: a page on another origin can make a signed-in person's browser send a POST
// here (a form with text/plain, or fetch with credentials). Browsers say where such a request comes from:
// Origin on every cross-origin POST/PUT/PATCH/DELETE, and Sec-Fetch-Site on every request in current ones.
// A request that carries neither was not sent by a browser page (curl, a script, the start script's
// internal calls, the integration tests); it can only act with credentials its sender already holds, so it
// is let through. Next's server actions make the same Origin/Host comparison themselves.
import { AppError } from "@/lib/errors";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

export type OriginFacts = {
  method: string;
  origin: string | null;
  secFetchSite: string | null;
  host: string | null;
  // "http" or "https": how this request reached the app (X-Forwarded-Proto when a proxy terminates TLS).
  protocol: string;
  appUrl: string | null;
};

function originOf(url: string): string | null {
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

export function sameOriginRequest(f: OriginFacts): boolean {
  if (SAFE_METHODS.has(f.method.toUpperCase())) return true;
  if (f.origin !== null) {
    // "null" is what sandboxed frames and some redirects send: never this app.
    if (f.origin === "null") return false;
    const given = originOf(f.origin);
    if (!given) return false;
    if (f.host && given === originOf(`${f.protocol}://${f.host}`)) return true;
    if (f.appUrl && given === originOf(f.appUrl)) return true;
    return false;
  }
  if (f.secFetchSite !== null) return f.secFetchSite === "same-origin" || f.secFetchSite === "none";
  return true;
}

function originFacts(req: Request, appUrl: string | null = process.env.APP_URL ?? null): OriginFacts {
  const forwarded = req.headers.get("x-forwarded-proto")?.split(",")[0]?.trim().toLowerCase();
  const protocol = forwarded === "https" || forwarded === "http" ? forwarded : new URL(req.url).protocol.replace(":", "");
  return {
    method: req.method,
    // An empty Origin is no origin at all (no browser sends one); it is treated as absent.
    origin: req.headers.get("origin") || null,
    secFetchSite: req.headers.get("sec-fetch-site") || null,
    host: req.headers.get("host"),
    protocol,
    appUrl,
  };
}

export function assertSameOrigin(req: Request): void {
  if (!sameOriginRequest(originFacts(req))) {
    throw new AppError("forbidden", "This request came from another site; it was refused. Use Gusset from its own address.");
  }
}
