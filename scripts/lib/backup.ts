// Backup and restore of a whole Gusset installation: the database (pg_dump custom format, from Debian's
// PostgreSQL package beside the server) and every object in the photo store, in one dated .tar.gz with a
// manifest of SHA-256 sums, so a restore can prove it put back exactly what was saved.
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import pg from "pg";
import { log } from "./log";
import { ensurePostgresInstalled } from "./postgres";
import { ensureBucket } from "./services";

const BACKUP_FORMAT = "gusset-backup/1";

export type StoreSettings = { endpoint: string; region: string; bucket: string; accessKeyId: string; secretAccessKey: string; forcePathStyle: boolean };

type Manifest = {
  format: typeof BACKUP_FORMAT;
  createdAt: string;
  database: { file: string; sha256: string; size: number };
  bucket: string;
  objects: { key: string; file: string; sha256: string; size: number; contentType?: string }[];
};

function sha256File(file: string) {
  return createHash("sha256").update(fs.readFileSync(file)).digest("hex");
}

function run(cmd: string, args: string[], what: string) {
  const r = spawnSync(cmd, args, { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
  if (r.error) throw new Error(`${what}: ${r.error.message}`);
  if (r.status !== 0) throw new Error(`${what} failed (exit ${r.status}): ${(r.stderr || r.stdout).trim()}`);
  return r;
}

function client(store: StoreSettings) {
  return new S3Client({
    endpoint: store.endpoint,
    region: store.region,
    forcePathStyle: store.forcePathStyle,
    credentials: { accessKeyId: store.accessKeyId, secretAccessKey: store.secretAccessKey },
  });
}

function stamp(d: Date) {
  return d.toISOString().replace(/[-:]/g, "").replace("T", "-").slice(0, 15);
}

/** Where the archive goes: a given .tar.gz path, a given folder, or .data/backups under the project. */
export function archivePath(target: string | undefined, root: string, now = new Date()): string {
  const name = `gusset-backup-${stamp(now)}.tar.gz`;
  if (!target) return path.join(root, ".data", "backups", name);
  const resolved = path.resolve(target);
  return resolved.endsWith(".tar.gz") || resolved.endsWith(".tgz") ? resolved : path.join(resolved, name);
}

export async function backup(opts: { databaseUrl: string; store: StoreSettings; archive: string }): Promise<{ archive: string; manifest: Manifest }> {
  const bin = ensurePostgresInstalled();
  const work = fs.mkdtempSync(path.join(os.tmpdir(), "gusset-backup-"));
  try {
    const dump = path.join(work, "database.dump");
    // --no-owner/--no-privileges: the dump restores into any role's database, not only one named like ours.
    run(path.join(bin, "pg_dump"), ["--format=custom", "--no-owner", "--no-privileges", `--file=${dump}`, `--dbname=${opts.databaseUrl}`], "pg_dump");
    log("db", `database dumped (${fs.statSync(dump).size} bytes)`);

    const s3 = client(opts.store);
    const objects: Manifest["objects"] = [];
    try {
      let token: string | undefined;
      do {
        const page = await s3.send(new ListObjectsV2Command({ Bucket: opts.store.bucket, ContinuationToken: token }));
        for (const item of page.Contents ?? []) {
          if (!item.Key) continue;
          const got = await s3.send(new GetObjectCommand({ Bucket: opts.store.bucket, Key: item.Key }));
          const bytes = Buffer.from(await got.Body!.transformToByteArray());
          const file = `objects/${objects.length.toString().padStart(6, "0")}`;
          fs.mkdirSync(path.join(work, "objects"), { recursive: true });
          fs.writeFileSync(path.join(work, file), bytes);
          objects.push({ key: item.Key, file, sha256: createHash("sha256").update(bytes).digest("hex"), size: bytes.length, ...(got.ContentType ? { contentType: got.ContentType } : {}) });
        }
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
    } finally {
      s3.destroy();
    }
    log("s3", `${objects.length} objects copied from bucket ${opts.store.bucket}`);

    const manifest: Manifest = {
      format: BACKUP_FORMAT,
      createdAt: new Date().toISOString(),
      database: { file: "database.dump", sha256: sha256File(dump), size: fs.statSync(dump).size },
      bucket: opts.store.bucket,
      objects,
    };
    fs.writeFileSync(path.join(work, "manifest.json"), `${JSON.stringify(manifest, null, 2)}\n`);
    fs.mkdirSync(path.dirname(opts.archive), { recursive: true });
    // Written beside the target, then renamed: a half-written archive never carries the final name.
    const partial = `${opts.archive}.partial`;
    run("tar", ["-czf", partial, "-C", work, "."], "tar");
    fs.renameSync(partial, opts.archive);
    return { archive: opts.archive, manifest };
  } finally {
    fs.rmSync(work, { recursive: true, force: true });
  }
}

/** Tables in the public schema: a database with any is not overwritten without --force. */
async function tableCount(databaseUrl: string): Promise<number> {
  const c = new pg.Client({ connectionString: databaseUrl });
  await c.connect();
  try {
    const r = await c.query<{ n: string }>("select count(*) as n from information_schema.tables where table_schema = 'public'");
    return Number(r.rows[0]?.n ?? 0);
  } finally {
    await c.end();
  }
}

export async function restore(opts: { databaseUrl: string; store: StoreSettings; archive: string; force: boolean }): Promise<Manifest> {
  if (!fs.existsSync(opts.archive)) throw new Error(`No archive at ${opts.archive}.`);
  const bin = ensurePostgresInstalled();
  const work = fs.mkdtempSync(path.join(os.tmpdir(), "gusset-restore-"));
  try {
    run("tar", ["-xzf", path.resolve(opts.archive), "-C", work], "tar");
    const manifestFile = path.join(work, "manifest.json");
    if (!fs.existsSync(manifestFile)) throw new Error("This archive has no manifest.json: it is not a Gusset backup.");
    const manifest = JSON.parse(fs.readFileSync(manifestFile, "utf8")) as Manifest;
    if (manifest.format !== BACKUP_FORMAT) throw new Error(`This archive is ${String(manifest.format)}, not ${BACKUP_FORMAT}.`);
    // Check every file against the manifest before touching anything.
    const dump = path.join(work, manifest.database.file);
    if (!fs.existsSync(dump) || sha256File(dump) !== manifest.database.sha256) throw new Error("The database dump in this archive does not match its manifest: the archive is damaged.");
    for (const o of manifest.objects) {
      const file = path.join(work, o.file);
      if (!fs.existsSync(file) || sha256File(file) !== o.sha256) throw new Error(`Object ${o.key} in this archive does not match its manifest: the archive is damaged.`);
    }

    const tables = await tableCount(opts.databaseUrl);
    if (tables > 0 && !opts.force) {
      throw new Error(`The database is not empty (${tables} tables). Restoring would replace it: run again with --force to do so.`);
    }
    const args = ["--no-owner", "--no-privileges", "--exit-on-error", "--single-transaction", `--dbname=${opts.databaseUrl}`];
    if (tables > 0) args.unshift("--clean", "--if-exists");
    run(path.join(bin, "pg_restore"), [...args, dump], "pg_restore");
    log("db", `database restored from ${path.basename(opts.archive)}`);

    await ensureBucket({ ...opts.store });
    const s3 = client(opts.store);
    try {
      for (const o of manifest.objects) {
        await s3.send(new PutObjectCommand({ Bucket: opts.store.bucket, Key: o.key, Body: fs.readFileSync(path.join(work, o.file)), ContentType: o.contentType }));
      }
    } finally {
      s3.destroy();
    }
    log("s3", `${manifest.objects.length} objects put back into bucket ${opts.store.bucket}`);
    return manifest;
  } finally {
    fs.rmSync(work, { recursive: true, force: true });
  }
}
