// Tablets and phones: HTTPS with the shop certificate, the http redirect, cookies, origins, the app manifest,
// and sign-in limits keyed by the socket's address.
import { randomUUID, X509Certificate } from "node:crypto";
import fs from "node:fs";
import https from "node:https";
import { describe, expect, it } from "vitest";
import { BASE_URL, DEMO_PASSWORD, fetchFrom, freshIp, signIn } from "./support";

const HTTPS_URL = new URL(process.env.GUSSET_TEST_HTTPS_URL ?? "https://shop-pc.test:3543");
const HTTP_PORT = new URL(BASE_URL).port;
const CA = fs.readFileSync(process.env.SHOP_CA_FILE!, "utf8");

// HTTPS to the app by its LAN name (connected to 127.0.0.1, as the name would resolve on the shop's network),
// trusting only the shop's authority, as a tablet with the certificate installed would.
function httpsRequest(path: string, init: { method?: string; headers?: Record<string, string>; body?: string } = {}) {
  return new Promise<{ status: number; headers: Record<string, string | string[] | undefined>; text: string; authorized: boolean }>((resolve, reject) => {
    const req = https.request(
      {
        host: "127.0.0.1",
        port: Number(HTTPS_URL.port),
        servername: HTTPS_URL.hostname,
        path,
        method: init.method ?? "GET",
        ca: CA,
        headers: { host: HTTPS_URL.host, ...init.headers },
      },
      (res) => {
        const authorized = (res.socket as import("node:tls").TLSSocket).authorized;
        let text = "";
        res.setEncoding("utf8");
        res.on("data", (c: string) => (text += c));
        res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, text, authorized }));
      },
    );
    req.on("error", reject);
    if (init.body) req.write(init.body);
    req.end();
  });
}

const signInBody = (email: string, password = DEMO_PASSWORD) => JSON.stringify({ email, password });

describe("HTTPS with the shop certificate", () => {
  it("answers on the LAN name with a certificate the shop authority vouches for", async () => {
    const res = await httpsRequest("/api/health");
    expect(res.authorized).toBe(true);
    expect(res.status).toBe(200);
  });

  it("signs in over HTTPS from the LAN origin with a Secure session cookie, and /api/me then knows the person", async () => {
    const res = await httpsRequest("/api/auth/sign-in/email", {
      method: "POST",
      headers: { "content-type": "application/json", origin: HTTPS_URL.origin },
      body: signInBody("welder@irongully.example"),
    });
    expect(res.status).toBe(200);
    const cookies = [res.headers["set-cookie"] ?? []].flat();
    const session = cookies.find((c) => c.includes("session_token="));
    expect(session).toMatch(/^__Secure-/);
    expect(session).toMatch(/;\s*Secure/i);
    expect(session).toMatch(/HttpOnly/i);
    const me = await httpsRequest("/api/me", { headers: { cookie: cookies.map((c) => c.split(";")[0]).join("; ") } });
    expect(me.status).toBe(200);
    expect(JSON.parse(me.text).user.email).toBe("welder@irongully.example");
  });

  it("refuses sign-in from an origin the certificate does not name", async () => {
    const res = await httpsRequest("/api/auth/sign-in/email", {
      method: "POST",
      headers: { "content-type": "application/json", origin: "https://elsewhere.example" },
      body: signInBody("welder@irongully.example"),
    });
    expect(res.status).toBe(403);
  });

  it("sends the LAN name over plain http to HTTPS, and serves this computer's own http", async () => {
    const lan = await fetchFrom("127.0.0.1", `http://127.0.0.1:${HTTP_PORT}/sign-in?next=%2Fjobs`, { headers: { host: `${HTTPS_URL.hostname}:${HTTP_PORT}` } });
    expect(lan.status).toBe(308);
    expect(lan.headers.get("location")).toBe(`${HTTPS_URL.origin}/sign-in?next=%2Fjobs`);
    const local = await fetchFrom("127.0.0.1", `${BASE_URL}/api/health`);
    expect(local.status).toBe(200);
  });

  it("hands out the shop authority (DER and PEM), even over http, so a device can install it first", async () => {
    const der = await fetchFrom("127.0.0.1", `http://127.0.0.1:${HTTP_PORT}/api/shop-certificate`, { headers: { host: `${HTTPS_URL.hostname}:${HTTP_PORT}` } });
    expect(der.status).toBe(200);
    expect(der.headers.get("content-type")).toBe("application/x-x509-ca-cert");
    const cert = new X509Certificate(Buffer.from(await der.arrayBuffer()));
    expect(cert.fingerprint256).toBe(new X509Certificate(CA).fingerprint256);
    expect(cert.ca).toBe(true);
    const pem = await fetchFrom("127.0.0.1", `${BASE_URL}/api/shop-certificate?format=pem`);
    expect((await pem.text()).trim()).toBe(CA.trim());
    expect((await fetchFrom("127.0.0.1", `${BASE_URL}/api/shop-certificate?format=p12`)).status).toBe(400);
  });
});

describe("installable", () => {
  it("serves a web app manifest with name, icons and standalone display", async () => {
    const res = await fetch(`${BASE_URL}/manifest.webmanifest`);
    expect(res.status).toBe(200);
    const m = await res.json();
    expect(m.name).toBe("Gusset");
    expect(m.display).toBe("standalone");
    expect(m.start_url).toBe("/");
    const sizes = m.icons.map((i: { sizes: string; purpose: string }) => `${i.sizes} ${i.purpose}`);
    expect(sizes).toEqual(expect.arrayContaining(["192x192 any", "512x512 any", "512x512 maskable"]));
    for (const icon of m.icons) {
      const img = await fetch(`${BASE_URL}${icon.src}`);
      expect(img.status).toBe(200);
      const bytes = Buffer.from(await img.arrayBuffer());
      // PNG signature, then the IHDR width and height (ISO/IEC 15948 §11.2.2).
      expect(bytes.subarray(1, 4).toString("latin1")).toBe("PNG");
      expect(`${bytes.readUInt32BE(16)}x${bytes.readUInt32BE(20)}`).toBe(icon.sizes);
    }
  });

  it("answers /favicon.ico", async () => {
    const res = await fetch(`${BASE_URL}/favicon.ico`);
    expect(res.status).toBe(200);
    const bytes = Buffer.from(await res.arrayBuffer());
    // ICONDIR: reserved 0, type 1 (icon), then the image count.
    expect([bytes.readUInt16LE(0), bytes.readUInt16LE(2)]).toEqual([0, 1]);
    expect(bytes.readUInt16LE(4)).toBeGreaterThan(0);
  });
});

describe("sign-in limits", () => {
  const tryFrom = (ip: string, email: string, password: string, forwardedFor?: string) =>
    fetchFrom(ip, `${BASE_URL}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: BASE_URL, ...(forwardedFor ? { "x-forwarded-for": forwardedFor } : {}) },
      body: signInBody(email, password),
    });

  it("ignores X-Forwarded-For: eight wrong passwords from one client under eight made-up addresses get a 429", async () => {
    const ip = freshIp();
    const statuses: number[] = [];
    for (let i = 0; i < 8; i++) statuses.push((await tryFrom(ip, "welder2@irongully.example", `wrong-${i}`, `203.0.113.${i + 1}`)).status);
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses.slice(5)).toEqual([429, 429, 429]);
    const body = await (await tryFrom(ip, "welder2@irongully.example", "wrong-again", "198.51.100.9")).json();
    expect(body.message).toMatch(/too many failed sign-ins/i);

    // Right after: another account's correct password from another address is not refused…
    expect((await tryFrom(freshIp(), "lead@saltpan.example", DEMO_PASSWORD)).status).toBe(200);
    // …nor this account's correct password from another device: the guesses were someone else's.
    expect((await tryFrom(freshIp(), "welder2@irongully.example", DEMO_PASSWORD)).status).toBe(200);
    // A colleague at the same tablet signs in to their own account too.
    expect((await tryFrom(ip, "inspector@irongully.example", DEMO_PASSWORD)).status).toBe(200);
  });

  it("limits one address trying many accounts", async () => {
    const ip = freshIp();
    const statuses: number[] = [];
    for (let i = 0; i < 21; i++) statuses.push((await tryFrom(ip, `nobody-${randomUUID()}@unknown.example`, "wrong-password")).status);
    expect(statuses.slice(0, 20).every((s) => s === 401)).toBe(true);
    expect(statuses[20]).toBe(429);
  });

  it("does not count successful sign-ins: many people can share one tablet", async () => {
    const ip = freshIp();
    for (let i = 0; i < 8; i++) expect((await signIn(i % 2 ? "welder@irongully.example" : "inspector@irongully.example", DEMO_PASSWORD, ip)).res.status).toBe(200);
  });
});
