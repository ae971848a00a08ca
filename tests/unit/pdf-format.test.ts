// Text, number and time formatting for the traveller, and the checks on its input data.
import { describe, expect, it } from "vitest";
import { formatInstant, formatNumber, formatSigned, groupHex, printable, printableLines, sealShort, wrapUrl } from "@/lib/pdf/format";
import { parseTravellerData, type TravellerData } from "@/lib/pdf/traveller-data";
import { woffToSfnt } from "@/lib/pdf/woff";
import { readFileSync } from "node:fs";
import path from "node:path";
import { buildTravellerFixture } from "@/tests/fixtures/pdf/traveller-fixture";

describe("printable text", () => {
  it("keeps what the embedded latin subsets draw and replaces the rest", () => {
    expect(printable("Iron Gully 4x4 — 120 °C ± 5 µm, Ø 1.0 mm, “ok”")).toBe("Iron Gully 4x4 — 120 °C ± 5 µm, Ø 1.0 mm, “ok”");
    expect(printable("≥ 9.0 mm, ≤ 0.5°, θ")).toBe(">= 9.0 mm, <= 0.5°, theta");
    expect(printable("Dvořák Łukasz Şahin")).toBe("Dvorák ?ukasz Sahin"); // á is latin-1; ř and Ş lose the mark; Ł has no plain form, so "?" shows something was there
    expect(printable("焊接")).toBe("??");
    expect(printable("a\nb\tc")).toBe("a b c"); // a line feed would be drawn in unembedded Helvetica
    expect(printableLines("one\r\ntwo\n\nthree\n\n")).toEqual(["one", "two", "", "three"]);
  });
});

describe("figures", () => {
  it("formats readings with a true minus sign and the asked decimals", () => {
    expect(formatNumber(9.52, 2)).toBe("9.52");
    expect(formatNumber(-420, 1)).toBe("\u2212420.0");
    expect(formatNumber(-0.0001, 2)).toBe("0.00");
    expect(formatNumber(1.23456)).toBe("1.235");
    expect(formatNumber(512)).toBe("512");
    expect(formatSigned(1.84, 2)).toBe("+1.84");
    expect(formatSigned(-75, 0)).toBe("\u221275");
    expect(formatSigned(0, 1)).toBe("0.0");
  });

  it("prints times in ISO 8601 order with the zone's offset", () => {
    const t = new Date("2026-03-04T10:22:00Z");
    expect(formatInstant(t, "UTC")).toBe("2026-03-04 10:22 UTC");
    expect(formatInstant(t, "Europe/Berlin")).toBe("2026-03-04 11:22 UTC+01:00");
    expect(formatInstant(t, "America/Denver")).toBe("2026-03-04 03:22 UTC-07:00");
  });

  it("shortens and groups the seal and wraps URLs without losing characters", () => {
    const seal = "ab".repeat(32);
    expect(sealShort(seal)).toBe("abababababab");
    expect(groupHex(seal).join("")).toBe(seal);
    expect(groupHex(seal)).toHaveLength(16);
    const url = "https://gusset.example/verify/tr_8QmZ3kV1pX7cJ2nR5wYb-and-a-long-tail-of-characters";
    const lines = wrapUrl(url, 38);
    expect(lines.join("")).toBe(url);
    for (const l of lines) expect(l.length).toBeLessThanOrEqual(38);
    expect(lines[0]).toBe("https://gusset.example/verify/");
  });
});

describe("fonts", () => {
  // W3C WOFF File Format 1.0: the SFNT keeps the flavor and every table, uncompressed.
  it("unwraps the shipped WOFF files to OpenType with every table intact", () => {
    const woff = readFileSync(path.join(process.cwd(), "public/fonts/ibm-plex-mono-latin-400-normal.woff"));
    const sfnt = woffToSfnt(woff);
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
    const tables = sfnt.readUInt16BE(4);
    expect(tables).toBe(woff.readUInt16BE(12));
    for (let i = 0; i < tables; i++) {
      const tag = sfnt.toString("latin1", 12 + i * 16, 16 + i * 16);
      const origLength = woff.readUInt32BE(44 + i * 20 + 12);
      expect(sfnt.readUInt32BE(12 + i * 16 + 12), tag).toBe(origLength);
    }
    expect(() => woffToSfnt(Buffer.from("not a font at all, just some words here to pass 44 bytes"))).toThrow(/WOFF/);
  });
});

describe("traveller data", () => {
  async function base(): Promise<TravellerData> {
    return buildTravellerFixture({ released: true, photos: 2, steps: 6 });
  }

  it("accepts the fixture and turns base64 photos and ISO times into bytes and dates", async () => {
    const d = parseTravellerData(await base());
    expect(d.photos).toHaveLength(2);
    for (const p of d.photos) expect(Buffer.isBuffer(p.image) && p.image[0] === 0xff).toBe(true);
    expect(d.dates.created).toBeInstanceOf(Date);
    expect(d.paper).toBe("a4");
  });

  it("refuses a released flag that disagrees with the state, or a released job without its time", async () => {
    const d = await base();
    expect(() => parseTravellerData({ ...d, state: "on_hold" })).toThrow(/released must be false/);
    expect(() => parseTravellerData({ ...d, released: false })).toThrow(/released must be true/);
    expect(() => parseTravellerData({ ...d, dates: { ...d.dates, released: null } })).toThrow(/release time/);
  });

  it("refuses an amendment that points at no sign-off on the traveller", async () => {
    const d = await base();
    const sections = structuredClone(d.sections);
    const step = sections[0]?.steps[0];
    if (!step?.signOffs?.[0]) throw new Error("fixture has no sign-off");
    step.signOffs.push({ ...step.signOffs[0], id: "so-new", amends: { signOffId: "so-missing", reason: "typo" } });
    expect(() => parseTravellerData({ ...d, sections })).toThrow(/amendment must point at another sign-off/);
  });

  it("refuses a seal that is not a SHA-256, a relative verify URL, and thumbnails that are not JPEG or PNG", async () => {
    const d = await base();
    expect(() => parseTravellerData({ ...d, seal: { ...d.seal, sha256: "CB2A" } })).toThrow();
    expect(() => parseTravellerData({ ...d, verifyUrl: "/verify/abc" })).toThrow();
    const webp = Buffer.from("RIFF\0\0\0\0WEBPVP8 ", "latin1");
    expect(() => parseTravellerData({ ...d, photos: [{ image: webp, caption: "x" }] })).toThrow(/JPEG or PNG/);
    expect(() => parseTravellerData({ ...d, timeZone: "Mars/Olympus" })).toThrow(/time zone/);
  });
});
