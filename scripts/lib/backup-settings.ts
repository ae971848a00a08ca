// Which database and object store `npm run backup` and `npm run restore` use: the ones in DATABASE_URL and
// S3_ENDPOINT when set, else the local ones `npm start` runs in .data (started for the duration if stopped).
import path from "node:path";
import { log } from "./log";
import { startLocalPostgres } from "./postgres";
import { startObjectStore } from "./services";
import type { StoreSettings } from "./backup";

export async function installationSettings(root: string): Promise<{ databaseUrl: string; store: StoreSettings; stop: () => Promise<void> }> {
  const stops: (() => unknown)[] = [];
  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const pgServer = await startLocalPostgres({
      dataDir: path.join(root, ".data", "postgres"),
      port: Number(process.env.PGPORT ?? 54329),
      database: "gusset",
      user: "gusset",
      password: "gusset-local",
    });
    stops.push(pgServer.stop);
    databaseUrl = pgServer.url;
  }
  const bucket = process.env.S3_BUCKET ?? "gusset-photos";
  let store: StoreSettings;
  if (process.env.S3_ENDPOINT) {
    store = {
      endpoint: process.env.S3_ENDPOINT,
      region: process.env.S3_REGION ?? "us-east-1",
      bucket,
      accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "S3RVER",
      secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
      forcePathStyle: (process.env.S3_FORCE_PATH_STYLE ?? "on") === "on",
    };
  } else {
    const port = Number(process.env.S3_PORT ?? 4569);
    const endpoint = `http://127.0.0.1:${port}`;
    const up = await fetch(endpoint).then(
      () => true,
      () => false,
    );
    if (!up) {
      const s3 = await startObjectStore({ port, directory: path.join(root, ".data", "s3"), bucket });
      stops.push(s3.stop);
    } else log("s3", `using the object store already on ${endpoint}`);
    store = { endpoint, region: "us-east-1", bucket, accessKeyId: "S3RVER", secretAccessKey: "S3RVER", forcePathStyle: true };
  }
  return {
    databaseUrl,
    store,
    stop: async () => {
      for (const stop of stops.reverse()) await stop();
    },
  };
}
