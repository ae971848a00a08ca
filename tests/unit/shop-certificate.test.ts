import { X509Certificate } from "node:crypto";
import fs from "node:fs";
import https from "node:https";
import type { AddressInfo } from "node:net";
import os from "node:os";
import path from "node:path";
import tls from "node:tls";
import { afterAll, describe, expect, it } from "vitest";
import { certificateNames, ensureShopCertificate, lanAddress, machineNames } from "../../scripts/lib/certs";

const iface = (address: string, family: "IPv4" | "IPv6", internal = false) =>
  ({ address, family, internal, netmask: "", mac: "00:00:00:00:00:00", cidr: null }) as os.NetworkInterfaceInfo;

const interfaces = {
  lo: [iface("127.0.0.1", "IPv4", true), iface("::1", "IPv6", true)],
  wlan0: [iface("192.168.20.14", "IPv4"), iface("fe80::1c2b:3aff:fe4d:5e6f", "IPv6"), iface("fd12:3456:789a::14", "IPv6")],
};

const dirs: string[] = [];
const tmp = () => {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), "gusset-tls-"));
  dirs.push(d);
  return d;
};
afterAll(() => dirs.forEach((d) => fs.rmSync(d, { recursive: true, force: true })));

describe("the names of this computer", () => {
  it("lists the host name, its .local name, each LAN address and the loopback names, without link-local IPv6", () => {
    expect(machineNames({ hostname: "Shop-PC", interfaces })).toEqual(["shop-pc", "shop-pc.local", "192.168.20.14", "fd12:3456:789a::14", "localhost", "127.0.0.1"]);
  });

  it("adds extra names once and keeps a host name that is already .local", () => {
    expect(machineNames({ hostname: "bay3.local", interfaces: {}, extra: ["gusset.shop.lan", "localhost"] })).toEqual(["bay3.local", "gusset.shop.lan", "localhost", "127.0.0.1"]);
  });

  it("gives tablets the LAN IPv4 address, which resolves without multicast DNS", () => {
    expect(lanAddress(machineNames({ hostname: "shop-pc", interfaces }))).toBe("192.168.20.14");
    expect(lanAddress(machineNames({ hostname: "shop-pc", interfaces: {} }))).toBe("shop-pc");
  });
});

describe("the shop certificate", () => {
  const names = machineNames({ hostname: "shop-pc", interfaces });

  it("names every address, is issued by the shop authority and is checked by Node's own X.509 code", () => {
    const c = ensureShopCertificate({ dir: tmp(), names, hostname: "shop-pc" });
    expect(c.created).toEqual({ ca: true, server: true });
    const cert = new X509Certificate(c.cert);
    const ca = new X509Certificate(c.caCertPem);
    expect(certificateNames(c.cert)).toEqual(["shop-pc", "shop-pc.local", "192.168.20.14", "fd12:3456:789a:0:0:0:0:14", "localhost", "127.0.0.1"]);
    for (const host of ["shop-pc", "shop-pc.local", "localhost"]) expect(cert.checkHost(host)).toBe(host);
    for (const ip of ["192.168.20.14", "127.0.0.1"]) expect(cert.checkIP(ip)).toBe(ip);
    expect(cert.checkHost("other-pc.local")).toBeUndefined();
    expect(cert.checkIssued(ca)).toBe(true);
    expect(cert.verify(ca.publicKey)).toBe(true);
    expect(ca.ca).toBe(true);
    expect(cert.ca).toBe(false);
    // Apple devices refuse server certificates valid for more than 825 days.
    expect((Date.parse(cert.validTo) - Date.parse(cert.validFrom)) / 86_400_000).toBeLessThanOrEqual(825);
    expect(c.caFingerprint).toBe(ca.fingerprint256);
  });

  it("is kept while the names stay, and reissued under the same authority when they change", () => {
    const dir = tmp();
    const first = ensureShopCertificate({ dir, names });
    const again = ensureShopCertificate({ dir, names: [...names].reverse() });
    expect(again.created).toEqual({ ca: false, server: false });
    expect(again.cert).toBe(first.cert);
    const moved = ensureShopCertificate({ dir, names: names.map((n) => (n === "192.168.20.14" ? "10.0.0.7" : n)) });
    expect(moved.created).toEqual({ ca: false, server: true });
    expect(moved.caCertPem).toBe(first.caCertPem);
    expect(certificateNames(moved.cert)).toContain("10.0.0.7");
    expect(certificateNames(moved.cert)).not.toContain("192.168.20.14");
  });

  it("is reissued when it nears its end", () => {
    const dir = tmp();
    const now = Date.now();
    const old = ensureShopCertificate({ dir, names, now: new Date(now - 380 * 86_400_000) });
    const renewed = ensureShopCertificate({ dir, names, now: new Date(now) });
    expect(renewed.created.server).toBe(true);
    expect(renewed.cert).not.toBe(old.cert);
  });

  it("lets a TLS client that trusts only the shop authority connect by any of the names", async () => {
    const c = ensureShopCertificate({ dir: tmp(), names: machineNames({ hostname: "shop-pc", interfaces: {} }) });
    const server = https.createServer({ key: c.key, cert: c.cert }, (_req, res) => res.end("ok"));
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    const port = (server.address() as AddressInfo).port;
    const connect = (servername: string) =>
      new Promise<boolean>((resolve) => {
        const s = tls.connect({ host: "127.0.0.1", port, ca: c.caCertPem, servername }, () => {
          resolve(s.authorized);
          s.end();
        });
        s.on("error", () => resolve(false));
      });
    try {
      expect(await connect("shop-pc.local")).toBe(true);
      expect(await connect("localhost")).toBe(true);
      expect(await connect("elsewhere.example")).toBe(false);
    } finally {
      server.close();
    }
  });
});
