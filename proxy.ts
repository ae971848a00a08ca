import { NextResponse, type NextRequest } from "next/server";
import { contentSecurityPolicy, HSTS, permissionsPolicy } from "@/lib/security-headers";
import { controlCharacterIn } from "@/lib/text-safety";

// Pages get a fresh CSP nonce per request (Next reads it from the request's CSP header and puts it on its
// own scripts), the camera policy of their screen, and HSTS when they were reached over HTTPS. API answers
// get fixed headers from next.config.mjs and are not matched here, so their bodies are never buffered.
export function proxy(request: NextRequest) {
  // Search boxes put their text in the address; a control character there would reach SQL.
  for (const [name, value] of request.nextUrl.searchParams) {
    if (controlCharacterIn(value) ?? controlCharacterIn(name)) {
      return new NextResponse("The address holds an invisible control character.", { status: 400, headers: { "content-type": "text/plain; charset=utf-8" } });
    }
  }
  const forwarded = request.headers.get("x-forwarded-proto")?.split(",")[0]?.trim().toLowerCase();
  const https = forwarded ? forwarded === "https" : request.nextUrl.protocol === "https:";
  const nonce = Buffer.from(crypto.randomUUID()).toString("base64");
  const csp = contentSecurityPolicy(nonce, { dev: process.env.NODE_ENV === "development", https });

  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("Content-Security-Policy", csp);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("Content-Security-Policy", csp);
  response.headers.set("Permissions-Policy", permissionsPolicy(request.nextUrl.pathname));
  if (https) response.headers.set("Strict-Transport-Security", HSTS);
  return response;
}

export const config = {
  matcher: [
    {
      source: "/((?!api/|_next/static|_next/image|favicon.ico).*)",
      missing: [
        { type: "header", key: "next-router-prefetch" },
        { type: "header", key: "purpose", value: "prefetch" },
      ],
    },
  ],
};
