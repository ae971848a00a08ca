import "server-only";
import { X509Certificate } from "node:crypto";
import fs from "node:fs";
import { env } from "@/lib/env";

type ShopAuthority = { pem: string; der: Buffer; fingerprint: string; subject: string; validTo: string };

// The shop's certificate authority that `npm start` made (public: devices install it to trust the shop's
// HTTPS). Null when Gusset sits behind a proxy with a certificate of its own.
export function shopAuthority(): ShopAuthority | null {
  const file = env().SHOP_CA_FILE;
  if (!file || !fs.existsSync(file)) return null;
  const pem = fs.readFileSync(file, "utf8");
  const x = new X509Certificate(pem);
  return { pem, der: x.raw, fingerprint: x.fingerprint256, subject: x.subject.replace(/\n/g, ", "), validTo: x.validTo };
}

// Where tablets and phones open Gusset: APP_URL when it is a public address of the shop's own, else this
// computer's HTTPS address on the shop's network; never a loopback address another device cannot reach.
export function publicBaseUrl(): string {
  const e = env();
  const app = new URL(e.APP_URL);
  const loopback = app.hostname === "localhost" || app.hostname.startsWith("127.") || app.hostname === "[::1]";
  return (loopback && e.LAN_URL ? e.LAN_URL : e.APP_URL).replace(/\/$/, "");
}
