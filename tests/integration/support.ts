// Talks to the app that `npm test` started (BASE_URL) and to its throwaway database.
import { randomInt } from "node:crypto";
import http from "node:http";
import pg from "pg";

export const BASE_URL = process.env.GUSSET_TEST_URL ?? "http://127.0.0.1:3100";
export const DEMO_PASSWORD = "demo-gusset-2026";

// Each caller gets its own client address, so sign-in rate limits of one test never leak into another. The
// app believes only the socket (X-Forwarded-For is a client's word), so requests really come from that
// address: every 127.x.y.z is this machine's loopback.
export function freshIp() {
  return `127.${randomInt(1, 255)}.${randomInt(0, 255)}.${randomInt(1, 254)}`;
}

// fetch() from a chosen loopback source address (fetch itself cannot bind one). No redirects are followed.
export function fetchFrom(ip: string, url: string, init: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Response> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method: init.method ?? "GET", headers: init.headers, localAddress: ip }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => {
        const headers = new Headers();
        for (let i = 0; i < res.rawHeaders.length; i += 2) headers.append(res.rawHeaders[i]!, res.rawHeaders[i + 1]!);
        const status = res.statusCode ?? 500;
        resolve(new Response([101, 204, 205, 304].includes(status) ? null : Buffer.concat(chunks), { status, headers }));
      });
      res.on("error", reject);
    });
    req.on("error", reject);
    if (init.body !== undefined) req.write(init.body);
    req.end();
  });
}

export type Session = { cookie: string; ip: string };

export async function signIn(email: string, password = DEMO_PASSWORD, ip = freshIp()) {
  const res = await fetchFrom(ip, `${BASE_URL}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: BASE_URL },
    body: JSON.stringify({ email, password }),
  });
  const setCookies = res.headers.getSetCookie();
  const cookie = setCookies.map((c) => c.split(";")[0]).join("; ");
  return { res, session: { cookie, ip } as Session, setCookies };
}

export async function session(email: string): Promise<Session> {
  const { res, session: s } = await signIn(email);
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${await res.text()}`);
  return s;
}

export async function api(path: string, opts: { session?: Session; method?: string; body?: unknown; headers?: Record<string, string> } = {}) {
  const headers: Record<string, string> = { origin: BASE_URL, ...opts.headers };
  if (opts.session) headers.cookie = opts.session.cookie;
  if (opts.body !== undefined) headers["content-type"] = "application/json";
  const res = await fetchFrom(opts.session?.ip ?? "127.0.0.1", `${BASE_URL}${path}`, {
    method: opts.method ?? (opts.body === undefined ? "GET" : "POST"),
    headers,
    body: opts.body === undefined ? undefined : typeof opts.body === "string" ? opts.body : JSON.stringify(opts.body),
  });
  const text = await res.text();
  let json: unknown = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = null;
  }
  return { status: res.status, json: json as Record<string, any>, text, headers: res.headers };
}

export async function withDb<T>(fn: (client: pg.Client) => Promise<T>, url = process.env.DATABASE_URL): Promise<T> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

export async function waitFor<T>(probe: () => Promise<T | null | undefined>, timeoutMs = 10_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error("timed out waiting");
    await new Promise((r) => setTimeout(r, 200));
  }
}
