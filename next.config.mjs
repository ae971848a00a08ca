/** @type {import('next').NextConfig} */
const nextConfig = {
  // Tests build into their own folder so they can run beside a running app.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
  // `npm test` typechecks the whole project as a stage of its own; the build need not do it again.
  typescript: { ignoreBuildErrors: true },
  // A server action's body passes through proxy.ts, which buffers it; actions take at most 1 MB (Next's
  // own limit, which answers the refusal), so nothing larger is ever held for one.
  experimental: { proxyClientMaxBodySize: "2mb" },
  // Pages get their CSP (with a per-request nonce), camera policy and HSTS from proxy.ts.
  async headers() {
    const everywhere = [
      { key: "X-Content-Type-Options", value: "nosniff" },
      { key: "Referrer-Policy", value: "same-origin" },
      { key: "X-Frame-Options", value: "DENY" },
    ];
    return [
      { source: "/:path*", headers: everywhere },
      // API answers are data, never a document to run: nothing loads from them, nothing frames them. The
      // traveller PDF opens in the browser's own viewer, which a `default-src 'none'` page cannot embed.
      {
        source: "/api/:path((?!jobs/[^/]+/traveller$).*)",
        headers: [
          { key: "Content-Security-Policy", value: "default-src 'none'; frame-ancestors 'none'" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=()" },
        ],
      },
      {
        source: "/api/jobs/:id/traveller",
        headers: [
          { key: "Content-Security-Policy", value: "frame-ancestors 'none'" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=()" },
        ],
      },
      // Behind a proxy that terminates TLS: tell browsers to keep to HTTPS.
      { source: "/:path*", has: [{ type: "header", key: "x-forwarded-proto", value: "https" }], headers: [{ key: "Strict-Transport-Security", value: "max-age=31536000" }] },
    ];
  },
};

export default nextConfig;
