import { readFileSync } from "node:fs";
import path from "node:path";

import { describe, expect, it } from "vitest";

import { canonicalJson, contentHash, sha256Hex } from "@/lib/seal";

// RFC 8785 (JSON Canonicalization Scheme, 2020). Example texts recalled from memory and matched
// against the RFC's examples as quoted by independent JCS implementations' test suites.
describe("canonicalJson — RFC 8785", () => {
  it("§3.2.2 example: literals, numbers and string escaping together (from memory)", () => {
    const input = JSON.parse(
      String.raw`{"numbers": [333333333.33333329, 1E30, 4.50, 2e-3, 0.000000000000000000000000001], "string": "\u20ac$\u000F\u000aA'\u0042\u0022\u005c\\\"\/", "literals": [null, true, false]}`,
    );
    expect(canonicalJson(input)).toBe(
      String.raw`{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],"string":"€$\u000f\nA'B\"\\\\\"/"}`,
    );
  });

  it("§3.2.3 example: keys sorted by UTF-16 code units, so U+1F600 (D83D DE00) precedes U+FB33 (from memory)", () => {
    const input = JSON.parse(
      String.raw`{"\u20ac": "Euro Sign", "\r": "Carriage Return", "\ufb33": "Hebrew Letter Dalet With Dagesh", "1": "One", "\ud83d\ude00": "Emoji: Grinning Face", "\u0080": "Control", "\u00f6": "Latin Small Letter O With Diaeresis"}`,
    );
    expect(canonicalJson(input)).toBe(
      '{"\\r":"Carriage Return","1":"One","\u0080":"Control","ö":"Latin Small Letter O With Diaeresis",' +
        '"€":"Euro Sign","😀":"Emoji: Grinning Face","\ufb33":"Hebrew Letter Dalet With Dagesh"}',
    );
  });

  it("§3.2.2.3 numbers: ECMAScript serialisation, -0 → 0 (from memory)", () => {
    expect(canonicalJson(1e30)).toBe("1e+30");
    expect(canonicalJson(4.5)).toBe("4.5");
    expect(canonicalJson(2e-3)).toBe("0.002");
    expect(canonicalJson(-0)).toBe("0");
    expect(canonicalJson(1e-27)).toBe("1e-27");
  });

  it("Appendix B number samples (from memory)", () => {
    expect(canonicalJson(5e-324)).toBe("5e-324");
    expect(canonicalJson(1.7976931348623157e308)).toBe("1.7976931348623157e+308");
    expect(canonicalJson(9007199254740992)).toBe("9007199254740992");
    expect(canonicalJson(1e21)).toBe("1e+21");
    expect(canonicalJson(999999999999999700000)).toBe("999999999999999700000");
    expect(canonicalJson(0.000001)).toBe("0.000001");
    expect(canonicalJson(9.999999999999997e-7)).toBe("9.999999999999997e-7");
  });

  it("§3.2.2.3: NaN and Infinity are errors, not 'null' (from memory)", () => {
    expect(() => canonicalJson(Number.NaN)).toThrow(TypeError);
    expect(() => canonicalJson({ a: Number.POSITIVE_INFINITY })).toThrow(TypeError);
  });

  it("§3.2.2.2 strings: control characters as lower-case \\u00xx, no escaping of '/' or non-ASCII (from memory)", () => {
    expect(canonicalJson("\u000f")).toBe(String.raw`"\u000f"`);
    expect(canonicalJson("a/b")).toBe('"a/b"');
    expect(canonicalJson("\n\t\b\f\r")).toBe(String.raw`"\n\t\b\f\r"`);
    expect(canonicalJson("€")).toBe('"€"');
  });

  it("lone surrogates are refused (RFC 8785 §3.2.2.2 requires valid Unicode; from memory)", () => {
    expect(() => canonicalJson("\ud800")).toThrow(TypeError);
  });

  it("nested objects are sorted at every level; array order is kept (§3.2.3)", () => {
    expect(canonicalJson({ b: [{ z: 1, a: 2 }, 3], a: { d: true, c: null } })).toBe('{"a":{"c":null,"d":true},"b":[{"a":2,"z":1},3]}');
  });

  it("a value with no JSON form is refused", () => {
    expect(() => canonicalJson(undefined)).toThrow(TypeError);
  });
});

describe("sha256Hex", () => {
  it('"abc" → ba7816bf… (FIPS 180-2, Appendix B.1)', () => {
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
  it("the 448-bit two-block message → 248d6a61… (FIPS 180-2, Appendix B.2; from memory)", () => {
    expect(sha256Hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq")).toBe(
      "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1",
    );
  });
  it('hashes the UTF-8 bytes of the text: "€" (e2 82 ac) → c4cc90ed… (computed with coreutils: printf "€" | sha256sum)', () => {
    expect(sha256Hex("€")).toBe("c4cc90ed3d26f12d4b08a75140970a7904035c31cbb4515a83f19b9003c00d1d");
  });
});

describe("contentHash", () => {
  it("= SHA-256 of canonical JSON, so key order does not matter", () => {
    expect(contentHash({ b: 1, a: 2 })).toBe(sha256Hex('{"a":2,"b":1}'));
    expect(contentHash({ a: 2, b: 1 })).toBe(contentHash({ b: 1, a: 2 }));
    expect(contentHash({ a: 1 })).not.toBe(contentHash({ a: 1.5 }));
  });
});

describe("the pure part of lib/seal is browser-safe", () => {
  it("canonical-json and chain-core import no Node module", () => {
    for (const file of ["canonical-json.ts", "chain-core.ts"]) {
      const text = readFileSync(path.resolve(import.meta.dirname, "../../lib/seal", file), "utf8");
      expect(text, file).not.toMatch(/from\s+["'](?:node:|fs|path|crypto|os)["'/]|require\(|\.\/sha256|\.\/chain["']/);
    }
  });
});
