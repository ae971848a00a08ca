import { describe, expect, it } from "vitest";
import { clientAddressFrom, hostWithoutPort, httpsOrigins, isLoopbackHost, usesSecureCookies } from "@/lib/net/addresses";

describe("the client's address", () => {
  it("with no trusted proxy is the socket's, whatever X-Forwarded-For says", () => {
    expect(clientAddressFrom("192.168.20.31", "10.9.9.9", 0)).toBe("192.168.20.31");
    expect(clientAddressFrom("::ffff:192.168.20.31", undefined, 0)).toBe("192.168.20.31");
  });

  it("behind one proxy is the entry that proxy appended, not what the client wrote before it", () => {
    // The client sent "X-Forwarded-For: 1.2.3.4"; the proxy at 10.0.0.2 appended the client's real address.
    expect(clientAddressFrom("10.0.0.2", "1.2.3.4, 203.0.113.7", 1)).toBe("203.0.113.7");
    expect(clientAddressFrom("10.0.0.2", "203.0.113.7", 1)).toBe("203.0.113.7");
    expect(clientAddressFrom("10.0.0.3", ["1.2.3.4, 203.0.113.7", "10.0.0.2"], 2)).toBe("203.0.113.7");
  });

  it("falls back to the socket when a trusted entry is not an address", () => {
    expect(clientAddressFrom("10.0.0.2", "not-an-ip", 1)).toBe("10.0.0.2");
  });
});

describe("hosts and origins", () => {
  it("tells this computer's names from the network's", () => {
    for (const h of ["127.0.0.1:3000", "localhost", "[::1]:3000", "127.5.6.7"]) expect(isLoopbackHost(h)).toBe(true);
    for (const h of ["shop-pc.local:3000", "192.168.20.14", "[fd12::14]:3443"]) expect(isLoopbackHost(h)).toBe(false);
    expect(hostWithoutPort("[fd12::14]:3443")).toBe("fd12::14");
  });

  it("writes an origin per name, IPv6 in brackets", () => {
    expect(httpsOrigins(["shop-pc.local", "fd12::14"], 3443)).toEqual(["https://shop-pc.local:3443", "https://[fd12::14]:3443"]);
    expect(httpsOrigins(["gusset.example"], 443)).toEqual(["https://gusset.example"]);
  });

  it("uses plain cookies only for plain http to this computer", () => {
    const h = (proto: string, host: string) => new Headers({ "x-forwarded-proto": proto, "x-forwarded-host": host });
    expect(usesSecureCookies(h("http", "127.0.0.1:3000"), "http://127.0.0.1:3000")).toBe(false);
    expect(usesSecureCookies(h("https", "127.0.0.1:3443"), "http://127.0.0.1:3000")).toBe(true);
    expect(usesSecureCookies(h("https", "shop-pc.local:3443"), "http://127.0.0.1:3000")).toBe(true);
    expect(usesSecureCookies(h("http", "shop-pc.local:3000"), "http://127.0.0.1:3000")).toBe(true);
    expect(usesSecureCookies(h("http", "127.0.0.1:3000"), "https://gusset.example")).toBe(true);
  });
});
