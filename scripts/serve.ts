// The app's own server: Next's request handler behind plain http on PORT (for this computer; other hosts are
// sent to HTTPS) and HTTPS on HTTPS_PORT with the shop certificate. It alone knows the socket, so it writes
// the client's address and the scheme into headers the app trusts, replacing whatever a client sent.
import fs from "node:fs";
import http from "node:http";
import https from "node:https";
import type { AddressInfo, Socket } from "node:net";
import path from "node:path";
import next from "next";
import { CLIENT_ADDRESS_HEADER, clientAddressFrom, hostWithoutPort, isLoopbackAddress, isLoopbackHost } from "../lib/net/addresses";

const root = path.resolve(import.meta.dirname, "..");
const dev = process.argv.includes("--dev");
const port = Number(process.env.PORT ?? 3000);
const httpsPort = Number(process.env.HTTPS_PORT ?? 3443);
const bind = process.env.BIND_ADDRESS ?? "127.0.0.1";
const hops = Number(process.env.TRUSTED_PROXY_HOPS ?? 0);
const tls = process.env.TLS_CERT_FILE && process.env.TLS_KEY_FILE ? { cert: process.env.TLS_CERT_FILE, key: process.env.TLS_KEY_FILE } : null;

const app = next({ dev, dir: root, hostname: "localhost", port });

function prepareHeaders(req: http.IncomingMessage, listenerPort: number) {
  const socket = req.socket as Socket & { encrypted?: boolean };
  const peer = socket.remoteAddress ?? "unknown";
  req.headers[CLIENT_ADDRESS_HEADER] = clientAddressFrom(peer, req.headers["x-forwarded-for"], hops);
  if (hops === 0) {
    // No proxy is trusted: every forwarding header is the client's own word, so ours replace them.
    delete req.headers.forwarded;
    delete req.headers["x-real-ip"];
    req.headers["x-forwarded-for"] = peer;
    req.headers["x-forwarded-proto"] = socket.encrypted ? "https" : "http";
    req.headers["x-forwarded-host"] = req.headers.host ?? "";
    req.headers["x-forwarded-port"] = String(listenerPort);
  } else {
    req.headers["x-forwarded-proto"] ??= socket.encrypted ? "https" : "http";
  }
}

function listen(server: http.Server, portNumber: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const onError = (error: NodeJS.ErrnoException) => {
      // A machine without IPv6 cannot bind `::`; every IPv4 address then.
      if (host === "::" && (error.code === "EAFNOSUPPORT" || error.code === "EADDRNOTAVAIL")) {
        listen(server, portNumber, "0.0.0.0").then(resolve, reject);
      } else reject(error);
    };
    server.once("error", onError);
    server.listen(portNumber, host, () => {
      server.off("error", onError);
      resolve();
    });
  });
}

async function main() {
  await app.prepare();
  const handle = app.getRequestHandler();
  const servers: http.Server[] = [];

  const plain = http.createServer((req, res) => {
    // Plain http is for this computer only: a tablet would send its session cookie in clear.
    // The shop certificate itself may come over http: a device fetches it before it can trust HTTPS.
    const local = isLoopbackHost(req.headers.host ?? "") && isLoopbackAddress(req.socket.remoteAddress ?? "");
    if (tls && !local && !(req.url ?? "").startsWith("/api/shop-certificate")) {
      const host = hostWithoutPort(req.headers.host ?? "localhost");
      const hostPart = host.includes(":") ? `[${host}]` : host;
      res.writeHead(308, { location: `https://${hostPart}${httpsPort === 443 ? "" : `:${httpsPort}`}${req.url ?? "/"}` });
      res.end();
      return;
    }
    prepareHeaders(req, port);
    void handle(req, res);
  });
  servers.push(plain);
  await listen(plain, port, bind);

  if (tls) {
    const secure = https.createServer({ cert: fs.readFileSync(tls.cert), key: fs.readFileSync(tls.key) }, (req, res) => {
      prepareHeaders(req, httpsPort);
      void handle(req, res);
    });
    servers.push(secure);
    await listen(secure, httpsPort, bind);
  }
  const upgrade = (app as unknown as { getUpgradeHandler?: () => (req: http.IncomingMessage, socket: unknown, head: Buffer) => Promise<void> }).getUpgradeHandler?.();
  if (upgrade) for (const s of servers) s.on("upgrade", (req, socket, head) => void upgrade(req, socket, head));

  const where = servers.map((s) => `${s instanceof https.Server ? "https" : "http"} :${(s.address() as AddressInfo).port}`).join(", ");
  console.log(`[app] listening on ${bind} (${where})`);

  const stop = () => {
    // Open keep-alive connections would hold close() for minutes; the parent also gives up after a while.
    for (const s of servers) {
      s.close();
      s.closeAllConnections();
    }
    setTimeout(() => process.exit(0), 3000).unref();
    void app.close().finally(() => process.exit(0));
  };
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
