// The browser-side protections every page carries. Scripts run only from this origin with the page's nonce
// ('strict-dynamic' lets Next's own chunks load the rest); style elements need the nonce too, while style
// attributes (charts, progress bars) stay allowed: they cannot run code.
export function contentSecurityPolicy(nonce: string, opts: { dev: boolean; https: boolean }): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${opts.dev ? " 'unsafe-eval'" : ""}`,
    `style-src 'self' ${opts.dev ? "'unsafe-inline'" : `'nonce-${nonce}'`}`,
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "media-src 'self' blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    // Only over HTTPS: on a plain-HTTP shop network it would send every asset to a port nobody serves.
    ...(opts.https ? ["upgrade-insecure-requests"] : []),
  ].join("; ");
}

// The camera is for the two screens that read it: the runner's photo capture and /scan's QR reader.
function usesCamera(pathname: string): boolean {
  return pathname === "/scan" || pathname.startsWith("/scan/") || pathname.startsWith("/run/");
}

export function permissionsPolicy(pathname: string): string {
  return [`camera=${usesCamera(pathname) ? "(self)" : "()"}`, "microphone=()", "geolocation=()", "payment=()", "usb=()"].join(", ");
}

export const HSTS = "max-age=31536000";
