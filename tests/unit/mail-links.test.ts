import { describe, expect, it } from "vitest";
import { splitMailLinks } from "@/lib/mail/links";

describe("links in a caught mail", () => {
  it("an invitation's address becomes a link, the sentence around it stays text", () => {
    const body = "Open https://shop-pc.test:3443/invite/abc123. It expires in 7 days.";
    expect(splitMailLinks(body)).toEqual([
      { text: "Open " },
      { text: "https://shop-pc.test:3443/invite/abc123", href: "https://shop-pc.test:3443/invite/abc123" },
      { text: ". It expires in 7 days." },
    ]);
  });
  it("keeps query strings and several links; nothing is lost when joined again", () => {
    const body = "Job: http://127.0.0.1:3000/jobs/1?tab=welds\nVerify (https://x.example/verify/t?seal=ab12)";
    const parts = splitMailLinks(body);
    expect(parts.filter((p) => p.href).map((p) => p.href)).toEqual(["http://127.0.0.1:3000/jobs/1?tab=welds", "https://x.example/verify/t?seal=ab12"]);
    expect(parts.map((p) => p.text).join("")).toBe(body);
  });
  it("a mail without addresses is one text part; other schemes are not linked", () => {
    expect(splitMailLinks("javascript:alert(1) and ftp://x")).toEqual([{ text: "javascript:alert(1) and ftp://x" }]);
  });
});
