// `npm run restore <archive> [--force]`: puts a backup back into the configured database and object store.
// A database that already has tables is replaced only with --force.
import path from "node:path";
import { restore } from "./lib/backup";
import { installationSettings } from "./lib/backup-settings";

const root = path.resolve(import.meta.dirname, "..");

async function main() {
  const args = process.argv.slice(2);
  const archive = args.find((a) => !a.startsWith("--"));
  if (!archive) throw new Error("Name the archive: npm run restore -- <archive.tar.gz> [--force]");
  const settings = await installationSettings(root);
  try {
    const manifest = await restore({ databaseUrl: settings.databaseUrl, store: settings.store, archive: path.resolve(archive), force: args.includes("--force") });
    console.log(`Restored ${archive} (made ${manifest.createdAt}): the database and ${manifest.objects.length} objects.`);
  } finally {
    await settings.stop();
  }
}

main().then(
  () => process.exit(0),
  (error: unknown) => {
    console.error(`Restore failed: ${(error as Error).message}`);
    process.exit(1);
  },
);
