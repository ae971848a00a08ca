import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { parseInline, parseMarkdown, plainText } from "@/lib/procedures/markdown";
import { Markdown } from "@/lib/procedures/markdown-view";

const html = (source: string) => renderToStaticMarkup(createElement(Markdown, { source }));

describe("instructions markdown", () => {
  it("renders headings, lists, bold, italic and code", () => {
    expect(html("# Fit-up\n\n- **Clamp** it\n- check _pitch_\n\nUse `WPS-2`.")).toBe(
      '<div class="space-y-2 leading-relaxed "><h3 class="text-lg font-bold">Fit-up</h3><ul class="list-disc space-y-1 pl-6"><li><strong>Clamp</strong> it</li><li>check <em>pitch</em></li></ul><p>Use <code class="rounded bg-graphite-100 px-1 font-mono text-[0.92em]">WPS-2</code>.</p></div>',
    );
  });

  it("keeps raw HTML as text: a script tag is shown, never run", () => {
    const out = html('<script>alert("x")</script><img src=x onerror=alert(1)>');
    expect(out).not.toContain("<script");
    expect(out).not.toContain("<img");
    expect(out).toContain("&lt;script&gt;");
  });

  it("links only to http(s) and mailto; a javascript: link stays plain text", () => {
    expect(html("[data](https://example.com/sheet)")).toContain('<a href="https://example.com/sheet" rel="noopener noreferrer nofollow" target="_blank"');
    const bad = html("[click](javascript:alert(1))");
    expect(bad).not.toContain("<a");
    expect(bad).toContain("[click](javascript:alert(1))");
  });

  it("numbered lists and quotes", () => {
    expect(parseMarkdown("1. one\n2. two").map((b) => b.type)).toEqual(["list"]);
    expect(parseMarkdown("> note").map((b) => b.type)).toEqual(["quote"]);
  });

  it("a lone asterisk (a multiplication or a footnote) is not italic", () => {
    expect(parseInline("3 * 4 mm")).toEqual([{ type: "text", text: "3 * 4 mm" }]);
  });

  it("plain text for summaries drops the markup", () => {
    expect(plainText("**Stop** and _ask_.\n\n- one\n- two")).toBe("Stop and ask. one; two");
  });
});
