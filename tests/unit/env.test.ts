import { describe, expect, it } from "vitest";
import { parseEnv } from "@/lib/env";

const base = { DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db", BETTER_AUTH_SECRET: "x".repeat(32) };

describe("settings", () => {
  it("fills the documented defaults", () => {
    const env = parseEnv(base);
    expect(env.APP_URL).toBe("http://127.0.0.1:3000");
    expect(env.AUTH_SIGNIN_LIMIT).toBe(5);
    expect(env.TRUSTED_PROXY_HOPS).toBe(0);
    expect(env.HTTPS_PORT).toBe(3443);
  });

  it("names every setting that is wrong", () => {
    expect(() => parseEnv({ DATABASE_URL: "nope", BETTER_AUTH_SECRET: "short" })).toThrow(/DATABASE_URL[\s\S]*BETTER_AUTH_SECRET/);
  });

  it("refuses a negative number of trusted proxies", () => {
    expect(() => parseEnv({ ...base, TRUSTED_PROXY_HOPS: "-1" })).toThrow(/TRUSTED_PROXY_HOPS/);
  });

  it("reads numbers from strings", () => {
    expect(parseEnv({ ...base, AUTH_SIGNIN_LIMIT: "9" }).AUTH_SIGNIN_LIMIT).toBe(9);
  });
});
