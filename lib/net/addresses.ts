// Which address a request came from, and which host names count as "this computer". Pure: used by the
// server in front of Next (scripts/serve.ts) and by the app.
import { isIP } from "node:net";

// The header the server in front of the app sets on every request (any value a client sends is replaced).
export const CLIENT_ADDRESS_HEADER = "x-gusset-client-address";

// `::ffff:10.0.0.5` is the IPv4 address 10.0.0.5 seen through an IPv6 socket.
function normaliseAddress(address: string): string {
  const a = address.trim().toLowerCase();
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/.exec(a);
  return mapped ? mapped[1]! : a;
}

// The client's address given the socket's peer and the X-Forwarded-For chain. Each trusted proxy appends the
// address it received the request from, so with `hops` trusted proxies the client is `hops` entries from the
// right of [...forwarded, socket]; entries further left were written by the client and prove nothing.
export function clientAddressFrom(socketAddress: string, forwardedFor: string | string[] | undefined, hops: number): string {
  const socket = normaliseAddress(socketAddress || "unknown");
  if (hops <= 0) return socket;
  const header = Array.isArray(forwardedFor) ? forwardedFor.join(",") : (forwardedFor ?? "");
  const chain = [
    ...header
      .split(",")
      .map((s) => s.trim())
      .filter(Boolean),
    socket,
  ];
  // Fewer entries than trusted hops: the leftmost one is the best any proxy vouched for.
  const picked = chain[Math.max(0, chain.length - 1 - hops)]!;
  return isIP(normaliseAddress(picked)) ? normaliseAddress(picked) : socket;
}

export function isLoopbackAddress(address: string): boolean {
  const a = normaliseAddress(address);
  return a === "::1" || (isIP(a) === 4 && a.startsWith("127."));
}

// The Host header without its port (`[::1]:3000` → `::1`, `shop-pc.local:3000` → `shop-pc.local`).
export function hostWithoutPort(host: string): string {
  const h = host.trim().toLowerCase();
  if (h.startsWith("[")) return h.slice(1, h.indexOf("]") > 0 ? h.indexOf("]") : undefined);
  const colon = h.lastIndexOf(":");
  return colon > 0 && h.indexOf(":") === colon ? h.slice(0, colon) : h;
}

export function isLoopbackHost(host: string): boolean {
  const h = hostWithoutPort(host);
  return h === "localhost" || h.endsWith(".localhost") || isLoopbackAddress(h);
}

// `https://name:port` for each name the certificate carries (IPv6 in brackets); the default port is left out.
export function httpsOrigins(names: readonly string[], port: number): string[] {
  return names.map((n) => {
    const host = isIP(n) === 6 ? `[${n}]` : n;
    return port === 443 ? `https://${host}` : `https://${host}:${port}`;
  });
}

// Cookies carry the Secure flag unless the request is plain http to this computer itself (the server in front
// sets X-Forwarded-Proto and sends other hosts' http to HTTPS). An https APP_URL means a TLS proxy in front.
export function usesSecureCookies(headers: Headers, appUrl: string): boolean {
  if (/^https:/i.test(appUrl)) return true;
  const proto = headers.get("x-forwarded-proto")?.split(",")[0]?.trim().toLowerCase();
  if (proto === "https") return true;
  return !isLoopbackHost(headers.get("x-forwarded-host") ?? headers.get("host") ?? "");
}
