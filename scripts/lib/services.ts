// Local stand-ins for hosted services: an SMTP catcher that files every mail in the database (the
// lead's Local mailbox page reads them there) and an S3-compatible store on disk.
import fs from "node:fs";
import { CreateBucketCommand, HeadBucketCommand, S3Client } from "@aws-sdk/client-s3";
import { simpleParser } from "mailparser";
import pg from "pg";
import S3rver from "s3rver";
import { SMTPServer } from "smtp-server";
import { log } from "./log";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
function shopHeader(value: unknown): string | null {
  const text = typeof value === "string" ? value.trim() : null;
  return text && UUID.test(text) ? text : null;
}

export async function startMailCatcher(opts: { port: number; databaseUrl: string }) {
  const pool = new pg.Pool({ connectionString: opts.databaseUrl, max: 2 });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    size: 30 * 1024 * 1024,
    // Connected clients get this long to finish when we stop, then are cut off (the default waits 30 s).
    closeTimeout: 2_000,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", async () => {
        try {
          const raw = Buffer.concat(chunks);
          const parsed = await simpleParser(raw);
          const to = [parsed.to].flat().filter(Boolean).map((a) => (a ? a.text : "")).join(", ");
          await pool.query(
            `insert into caught_mail (message_id, from_address, to_address, subject, text_body, html_body, attachments, raw, shop_id)
             values ($1, $2, $3, $4, $5, $6, $7, $8, $9)`,
            [
              parsed.messageId ?? null,
              parsed.from?.text ?? "",
              to,
              parsed.subject ?? "",
              parsed.text ?? "",
              typeof parsed.html === "string" ? parsed.html : null,
              JSON.stringify(parsed.attachments.map((a) => ({ filename: a.filename ?? null, contentType: a.contentType, size: a.size }))),
              raw.toString("utf8"),
              shopHeader(parsed.headers.get("x-gusset-shop")),
            ],
          );
          callback();
        } catch (error) {
          log("mail", `could not file a caught mail: ${(error as Error).message}`);
          callback(error as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, "127.0.0.1", () => resolve());
  });
  log("mail", `local mail catcher on smtp://127.0.0.1:${opts.port}`);
  return {
    url: `smtp://127.0.0.1:${opts.port}`,
    stop: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await pool.end();
    },
  };
}

export async function startObjectStore(opts: { port: number; directory: string; bucket: string }) {
  fs.mkdirSync(opts.directory, { recursive: true });
  const server = new S3rver({ port: opts.port, address: "127.0.0.1", directory: opts.directory, silent: true });
  await server.run();
  const endpoint = `http://127.0.0.1:${opts.port}`;
  const credentials = { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" };
  await ensureBucket({ endpoint, bucket: opts.bucket, region: "us-east-1", ...credentials });
  log("s3", `local object store on ${endpoint} (bucket ${opts.bucket})`);
  const stop = async () => {
    // Keep-alive connections from the app would otherwise hold close() open.
    (server as unknown as { httpServer?: import("node:http").Server }).httpServer?.closeAllConnections();
    await server.close();
  };
  return { endpoint, ...credentials, stop };
}

export async function ensureBucket(opts: {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
}) {
  const client = new S3Client({
    endpoint: opts.endpoint,
    region: opts.region,
    forcePathStyle: true,
    credentials: { accessKeyId: opts.accessKeyId, secretAccessKey: opts.secretAccessKey },
  });
  try {
    await client.send(new HeadBucketCommand({ Bucket: opts.bucket }));
  } catch {
    await client.send(new CreateBucketCommand({ Bucket: opts.bucket }));
  }
  client.destroy();
}
