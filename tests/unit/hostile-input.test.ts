import { describe, expect, it } from "vitest";
import { controlCharacterFields, formControlCharacterFields, parseUntrustedJson, readBodyBytes, readJson } from "@/lib/api/body";
import { sameOriginRequest, type OriginFacts } from "@/lib/api/origin";
import { errorResponse } from "@/lib/api/route";
import { AppError, isDatabaseUnavailable } from "@/lib/errors";
import { parseProcedureFile } from "@/lib/procedures/file";
import { duplicateMembers, jsonDepthExceeds, JsonTooDeepError, MAX_JSON_DEPTH } from "@/lib/procedures/json-scan";
import { contentSecurityPolicy, permissionsPolicy } from "@/lib/security-headers";
import { controlCharacterIn } from "@/lib/text-safety";

function refusal(fn: () => unknown): AppError {
  try {
    fn();
  } catch (error) {
    if (error instanceof AppError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

async function refusalOf(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (error) {
    if (error instanceof AppError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
}

describe("JSON nesting", () => {
  it("measures depth outside strings only", () => {
    expect(jsonDepthExceeds("[[[]]]", 3)).toBe(false);
    expect(jsonDepthExceeds("[[[[]]]]", 3)).toBe(true);
    expect(jsonDepthExceeds('{"a":"[[[[[[[["}', 2)).toBe(false);
    expect(jsonDepthExceeds('{"a":"\\"[[[["}', 1)).toBe(false);
  });

  it("refuses 100,000 nested arrays in one pass, before anything is parsed", () => {
    const text = "[".repeat(100_000) + "]".repeat(100_000);
    expect(jsonDepthExceeds(text)).toBe(true);
    expect(() => duplicateMembers(text)).toThrow(JsonTooDeepError);
    const r = parseProcedureFile(text);
    expect(!r.ok && r.status).toBe(400);
    expect(!r.ok && r.message).toContain(`more than ${MAX_JSON_DEPTH} levels`);
  });

  it("finds repeated members at the deepest allowed level with their full path", () => {
    let text = '{"k":1,"k":2}';
    for (let d = 1; d < MAX_JSON_DEPTH; d++) text = `[${text}]`;
    const found = duplicateMembers(text);
    expect(found).toHaveLength(1);
    expect(found[0]!.path).toEqual([...Array(MAX_JSON_DEPTH - 1).fill(0), "k"]);
  });

  it("decodes escaped member names before comparing them", () => {
    expect(duplicateMembers('{"a\\u0062":1,"ab":2}')).toEqual([{ path: ["ab"], name: "ab" }]);
  });
});

// C0 controls are U+0000–U+001F and DEL is U+007F (Unicode Standard, chapter 23.1, "Control Codes").
describe("control characters in text", () => {
  it("refuses NUL and the other C0 controls but keeps tab, line feed and carriage return", () => {
    expect(controlCharacterIn("Axle\u0000shop")).toBe("U+0000");
    expect(controlCharacterIn("bell\u0007")).toBe("U+0007");
    expect(controlCharacterIn("del\u007f")).toBe("U+007F");
    expect(controlCharacterIn("line one\r\nline two\tend")).toBeNull();
    expect(controlCharacterIn("Ünïcödé – 25 °C")).toBeNull();
  });

  it("names the field a JSON value carries it in, member names included", () => {
    expect(controlCharacterFields({ customerName: "A\u0000B", notes: "two\nlines", steps: [{ title: "x\u001b" }], ["bad\u0001key"]: 1 })).toEqual({
      customerName: [expect.stringContaining("U+0000")],
      "steps.0.title": [expect.stringContaining("U+001B")],
      "bad\u0001key": [expect.stringContaining("U+0001")],
    });
    const e = refusal(() => parseUntrustedJson(JSON.stringify({ customerName: "Axle\u0000Works" })));
    expect(e.status).toBe(400);
    expect(e.fields).toEqual({ customerName: [expect.stringContaining("U+0000")] });
  });

  it("checks a server action's raw form fields", () => {
    const fd = new FormData();
    fd.set("title", "Bracket\u0000");
    fd.set("notes", "first\nsecond");
    expect(formControlCharacterFields(fd)).toEqual({ title: [expect.stringContaining("U+0000")] });
  });

  it("lists a control character in a procedure file as a problem with its place", () => {
    const r = parseProcedureFile(JSON.stringify({ format: "gusset-procedure", formatVersion: 1, procedure: { title: "T\u0000" } }));
    expect(!r.ok && r.problems.some((p) => p.path === "procedure.title" && p.message.includes("U+0000"))).toBe(true);
  });
});

function chunked(total: number, chunk = 64 * 1024): ReadableStream<Uint8Array> {
  let sent = 0;
  return new ReadableStream({
    pull(controller) {
      if (sent >= total) return controller.close();
      const n = Math.min(chunk, total - sent);
      sent += n;
      controller.enqueue(new Uint8Array(n).fill(0x20));
    },
  });
}

describe("request bodies", () => {
  it("stops reading a body without a length at the first byte past the limit", async () => {
    let pulled = 0;
    const source = chunked(64 * 1024 * 1024);
    const counted = source.pipeThrough(
      new TransformStream<Uint8Array, Uint8Array>({
        transform(c, ctl) {
          pulled += c.byteLength;
          ctl.enqueue(c);
        },
      }),
    );
    const req = new Request("http://x/api/calc/dew-point", { method: "POST", body: counted, headers: { "content-type": "application/json" }, duplex: "half" } as RequestInit);
    const e = await refusalOf(readBodyBytes(req, 1024 * 1024));
    expect(e.status).toBe(413);
    // Read up to the limit plus what was already in flight, never the 64 MB.
    expect(pulled).toBeLessThan(4 * 1024 * 1024);
  });

  it("refuses a declared length over the limit before reading", async () => {
    const req = new Request("http://x/", { method: "POST", body: "{}", headers: { "content-type": "application/json", "content-length": String(10 * 1024 * 1024) } });
    expect((await refusalOf(readBodyBytes(req, 1024))).status).toBe(413);
  });

  it("takes JSON only as application/json (or a +json type)", async () => {
    const plain = new Request("http://x/", { method: "POST", body: "{}", headers: { "content-type": "text/plain" } });
    expect((await refusalOf(readJson(plain))).status).toBe(415);
    const json = new Request("http://x/", { method: "POST", body: '{"a":1}', headers: { "content-type": "application/json; charset=utf-8" } });
    expect(await readJson(json)).toEqual({ a: 1 });
  });
});

describe("same-origin writes", () => {
  const base: OriginFacts = { method: "POST", origin: null, secFetchSite: null, host: "shop-pc.test:3000", protocol: "http", appUrl: "https://gusset.example.test" };
  it("lets the app's own pages write, by Host or by APP_URL", () => {
    expect(sameOriginRequest({ ...base, origin: "http://shop-pc.test:3000" })).toBe(true);
    expect(sameOriginRequest({ ...base, origin: "https://gusset.example.test" })).toBe(true);
    expect(sameOriginRequest({ ...base, secFetchSite: "same-origin" })).toBe(true);
  });
  it("refuses another site, a sibling port and the opaque origin", () => {
    expect(sameOriginRequest({ ...base, origin: "http://evil.test" })).toBe(false);
    expect(sameOriginRequest({ ...base, origin: "http://shop-pc.test:4000" })).toBe(false);
    expect(sameOriginRequest({ ...base, origin: "https://shop-pc.test:3000" })).toBe(false);
    expect(sameOriginRequest({ ...base, origin: "null" })).toBe(false);
    expect(sameOriginRequest({ ...base, secFetchSite: "cross-site" })).toBe(false);
    expect(sameOriginRequest({ ...base, secFetchSite: "same-site" })).toBe(false);
  });
  it("lets reads through and lets a request no browser sent (neither header) through", () => {
    expect(sameOriginRequest({ ...base, method: "GET", origin: "http://evil.test" })).toBe(true);
    expect(sameOriginRequest(base)).toBe(true);
  });
});

// SQLSTATE class 08 and 57P01–57P03: PostgreSQL documentation, Appendix A "PostgreSQL Error Codes".
describe("database down", () => {
  it("recognises refused, dropped and shutting-down connections, wrapped or not", () => {
    const refused = Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:5432"), { code: "ECONNREFUSED" });
    expect(isDatabaseUnavailable(refused)).toBe(true);
    expect(isDatabaseUnavailable(new Error("Failed query: insert ...", { cause: refused }))).toBe(true);
    expect(isDatabaseUnavailable(new AggregateError([refused], ""))).toBe(true);
    expect(isDatabaseUnavailable(Object.assign(new Error("terminating connection due to administrator command"), { code: "57P01" }))).toBe(true);
    expect(isDatabaseUnavailable(Object.assign(new Error("connection failure"), { code: "08006" }))).toBe(true);
    expect(isDatabaseUnavailable(new Error("Connection terminated unexpectedly"))).toBe(true);
  });
  it("leaves a query the database refused alone", () => {
    expect(isDatabaseUnavailable(Object.assign(new Error("duplicate key"), { code: "23505" }))).toBe(false);
    expect(isDatabaseUnavailable(new TypeError("x is undefined"))).toBe(false);
  });
  it("answers 503 with Retry-After, and a plain bug stays a 500", async () => {
    const res = errorResponse(new Error("Failed query", { cause: Object.assign(new Error("connect ECONNREFUSED"), { code: "ECONNREFUSED" }) }));
    expect(res.status).toBe(503);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
    expect((await res.json()).error.code).toBe("unavailable");
    const bug = errorResponse(new TypeError("x is undefined"));
    expect(bug.status).toBe(500);
    expect(bug.headers.get("retry-after")).toBeNull();
  });
});

describe("security headers", () => {
  it("puts the nonce on scripts and styles and upgrades requests only over HTTPS", () => {
    const csp = contentSecurityPolicy("abc123", { dev: false, https: false });
    expect(csp).toContain("script-src 'self' 'nonce-abc123' 'strict-dynamic'");
    expect(csp).toContain("style-src 'self' 'nonce-abc123'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toContain("unsafe-eval");
    expect(csp).not.toContain("upgrade-insecure-requests");
    expect(contentSecurityPolicy("n", { dev: false, https: true })).toContain("upgrade-insecure-requests");
  });
  it("allows the camera on the runner and /scan only", () => {
    expect(permissionsPolicy("/scan")).toContain("camera=(self)");
    expect(permissionsPolicy("/run/5d0c3e1a")).toContain("camera=(self)");
    expect(permissionsPolicy("/jobs/5d0c3e1a")).toContain("camera=()");
    expect(permissionsPolicy("/sign-in")).toContain("camera=()");
  });
});
