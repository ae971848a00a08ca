// The shop's own certificate authority and the certificate `npm start` serves HTTPS with. The authority is
// made once and kept in .data/tls (people install it on their tablets once); the server certificate names
// every address of this computer and is reissued when they change or it nears its end.
import { generateKeyPairSync, randomBytes, X509Certificate } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { isIP } from "node:net";
import forge from "node-forge";

const DAY = 24 * 3600 * 1000;
// Apple devices refuse server certificates valid for more than 825 days even from a private authority;
// 397 days keeps within the stricter public rule too.
const SERVER_DAYS = 397;
const CA_YEARS = 10;
const RENEW_BEFORE_DAYS = 30;

type Interfaces = NodeJS.Dict<os.NetworkInterfaceInfo[]>;

// Every name a device on the shop's network may use for this computer: its host name, the `.local` name
// that multicast DNS answers, each LAN address, and the loopback names. Link-local IPv6 addresses are left
// out: they need a zone (`%eth0`) that no certificate can carry.
export function machineNames(opts: { hostname?: string; interfaces?: Interfaces; extra?: readonly string[] } = {}): string[] {
  const hostname = (opts.hostname ?? os.hostname()).trim().toLowerCase();
  const interfaces = opts.interfaces ?? os.networkInterfaces();
  const names: string[] = [];
  const add = (n: string) => {
    const v = n.trim().toLowerCase();
    if (v && !names.includes(v)) names.push(v);
  };
  if (hostname && !isIP(hostname)) {
    add(hostname);
    const short = hostname.split(".")[0]!;
    add(hostname.endsWith(".local") ? hostname : `${short}.local`);
  }
  for (const n of opts.extra ?? []) add(n);
  for (const list of Object.values(interfaces)) {
    for (const i of list ?? []) {
      if (i.internal) continue;
      if (i.family === "IPv6" && /^fe[89ab]/i.test(i.address)) continue;
      add(i.address);
    }
  }
  add("localhost");
  add("127.0.0.1");
  return names;
}

// The address tablets and phones should open: the first LAN IPv4 address (names that need multicast DNS
// do not resolve on every Android tablet), else the host name.
export function lanAddress(names: readonly string[]): string | null {
  return names.find((n) => isIP(n) === 4 && !n.startsWith("127.")) ?? names.find((n) => !isIP(n) && n !== "localhost") ?? null;
}

export type ShopCertificate = {
  key: string;
  cert: string;
  caCertPem: string;
  caCertDer: Buffer;
  caFingerprint: string;
  names: string[];
  files: { caCert: string; key: string; cert: string };
  created: { ca: boolean; server: boolean };
};

function serial(): string {
  // Positive (first bit clear) and unique enough that no two certificates of one authority share it.
  const b = randomBytes(16);
  b[0] = b[0]! & 0x7f;
  return b.toString("hex");
}

function newKeys() {
  const { privateKey } = generateKeyPairSync("rsa", { modulusLength: 2048 });
  const pem = privateKey.export({ type: "pkcs1", format: "pem" }).toString();
  const priv = forge.pki.privateKeyFromPem(pem) as forge.pki.rsa.PrivateKey;
  return { pem, privateKey: priv, publicKey: forge.pki.setRsaPublicKey(priv.n, priv.e) };
}

function makeAuthority(now: Date, hostname: string) {
  const keys = newKeys();
  const cert = forge.pki.createCertificate();
  cert.publicKey = keys.publicKey;
  cert.serialNumber = serial();
  cert.validity.notBefore = new Date(now.getTime() - DAY);
  cert.validity.notAfter = new Date(now.getTime() + CA_YEARS * 365 * DAY);
  const subject = [
    { name: "commonName", value: `Gusset shop authority ${hostname}`.slice(0, 64) },
    { name: "organizationName", value: "Gusset (this shop's own)" },
  ];
  cert.setSubject(subject);
  cert.setIssuer(subject);
  cert.setExtensions([
    { name: "basicConstraints", cA: true, pathLenConstraint: 0, critical: true },
    { name: "keyUsage", keyCertSign: true, cRLSign: true, critical: true },
    { name: "subjectKeyIdentifier" },
  ]);
  cert.sign(keys.privateKey, forge.md.sha256.create());
  return { keyPem: keys.pem, certPem: forge.pki.certificateToPem(cert) };
}

function makeServerCertificate(now: Date, names: readonly string[], ca: { keyPem: string; certPem: string }) {
  const caCert = forge.pki.certificateFromPem(ca.certPem);
  const caKey = forge.pki.privateKeyFromPem(ca.keyPem);
  const keys = newKeys();
  const cert = forge.pki.createCertificate();
  cert.publicKey = keys.publicKey;
  cert.serialNumber = serial();
  cert.validity.notBefore = new Date(now.getTime() - DAY);
  cert.validity.notAfter = new Date(now.getTime() + SERVER_DAYS * DAY);
  cert.setSubject([{ name: "commonName", value: (names[0] ?? "localhost").slice(0, 64) }]);
  cert.setIssuer(caCert.subject.attributes);
  cert.setExtensions([
    { name: "basicConstraints", cA: false, critical: true },
    { name: "keyUsage", digitalSignature: true, keyEncipherment: true, critical: true },
    { name: "extKeyUsage", serverAuth: true },
    { name: "subjectAltName", altNames: names.map((n) => (isIP(n) ? { type: 7, ip: n } : { type: 2, value: n })) },
    { name: "subjectKeyIdentifier" },
    { name: "authorityKeyIdentifier", keyIdentifier: caCert.generateSubjectKeyIdentifier().getBytes() },
  ]);
  cert.sign(caKey, forge.md.sha256.create());
  return { keyPem: keys.pem, certPem: forge.pki.certificateToPem(cert) };
}

// The names a server certificate carries, read back by Node's own X.509 parser.
export function certificateNames(certPem: string): string[] {
  const alt = new X509Certificate(certPem).subjectAltName ?? "";
  return alt
    .split(", ")
    .map((entry) => entry.replace(/^(DNS|IP Address):/, "").toLowerCase())
    .filter(Boolean);
}

export function ensureShopCertificate(opts: { dir: string; names: readonly string[]; now?: Date; hostname?: string }): ShopCertificate {
  const now = opts.now ?? new Date();
  fs.mkdirSync(opts.dir, { recursive: true, mode: 0o700 });
  const files = {
    caKey: path.join(opts.dir, "shop-ca.key.pem"),
    caCert: path.join(opts.dir, "shop-ca.crt.pem"),
    key: path.join(opts.dir, "server.key.pem"),
    cert: path.join(opts.dir, "server.crt.pem"),
  };
  const created = { ca: false, server: false };
  if (!fs.existsSync(files.caKey) || !fs.existsSync(files.caCert)) {
    const ca = makeAuthority(now, opts.hostname ?? os.hostname());
    fs.writeFileSync(files.caKey, ca.keyPem, { mode: 0o600 });
    fs.writeFileSync(files.caCert, ca.certPem);
    created.ca = true;
  }
  const ca = { keyPem: fs.readFileSync(files.caKey, "utf8"), certPem: fs.readFileSync(files.caCert, "utf8") };
  const current = fs.existsSync(files.cert) && fs.existsSync(files.key) ? fs.readFileSync(files.cert, "utf8") : "";
  const isCurrent = current !== "" && serverIsCurrent(current, ca.certPem, opts.names, now);
  if (!isCurrent) {
    const server = makeServerCertificate(now, opts.names, ca);
    fs.writeFileSync(files.key, server.keyPem, { mode: 0o600 });
    fs.writeFileSync(files.cert, server.certPem);
    created.server = true;
  }
  const caX509 = new X509Certificate(ca.certPem);
  return {
    key: fs.readFileSync(files.key, "utf8"),
    cert: fs.readFileSync(files.cert, "utf8"),
    caCertPem: ca.certPem,
    caCertDer: caX509.raw,
    caFingerprint: caX509.fingerprint256,
    names: [...opts.names],
    files: { caCert: files.caCert, key: files.key, cert: files.cert },
    created,
  };
}

function serverIsCurrent(certPem: string, caCertPem: string, names: readonly string[], now: Date) {
  try {
    const cert = new X509Certificate(certPem);
    const ca = new X509Certificate(caCertPem);
    if (!cert.checkIssued(ca) || !cert.verify(ca.publicKey)) return false;
    if (new Date(cert.validTo).getTime() - now.getTime() < RENEW_BEFORE_DAYS * DAY) return false;
    const want = [...new Set(names.map((n) => canonicalName(n)))].sort();
    const have = [...new Set(certificateNames(certPem).map((n) => canonicalName(n)))].sort();
    return JSON.stringify(want) === JSON.stringify(have);
  } catch {
    return false;
  }
}

// OpenSSL prints IPv6 addresses expanded and in upper case; compare them in one spelling.
function canonicalName(n: string): string {
  const v = n.toLowerCase();
  if (isIP(v) !== 6) return v;
  return new URL(`http://[${v}]/`).hostname;
}
