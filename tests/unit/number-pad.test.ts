import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { NumberPad } from "@/components/runner/number-pad";

// The pad a welder types a PIN or a reading on reads like a phone's: 1-2-3 on the top row, 0 at the bottom.
describe("number pad layout", () => {
  it("puts 1 2 3 first and 0 on the bottom row", () => {
    const html = renderToStaticMarkup(createElement(NumberPad, { onKey: () => {} }));
    const labels = [...html.matchAll(/aria-label="([^"]+)"/g)].map((m) => m[1]).filter((l) => l !== "Number pad");
    expect(labels.slice(0, 12)).toEqual(["1", "2", "3", "4", "5", "6", "7", "8", "9", "Decimal point", "0", "Delete last"]);
  });
  it("offers Clear instead of a decimal point where only whole numbers go (a PIN)", () => {
    const html = renderToStaticMarkup(createElement(NumberPad, { onKey: () => {}, decimals: false }));
    const labels = [...html.matchAll(/aria-label="([^"]+)"/g)].map((m) => m[1]);
    expect(labels.slice(1, 13)).toEqual(["1", "2", "3", "4", "5", "6", "7", "8", "9", "Clear", "0", "Delete last"]);
  });
});
