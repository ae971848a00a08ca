// `npm run backup [path]`: the database and every stored photo into one dated .tar.gz
// (.data/backups/gusset-backup-YYYYMMDD-HHMMSS.tar.gz unless a folder or a .tar.gz path is given).
import path from "node:path";
import { archivePath, backup } from "./lib/backup";
import { installationSettings } from "./lib/backup-settings";

const root = path.resolve(import.meta.dirname, "..");

async function main() {
  const target = process.argv.slice(2).find((a) => !a.startsWith("--"));
  const settings = await installationSettings(root);
  try {
    const { archive, manifest } = await backup({ databaseUrl: settings.databaseUrl, store: settings.store, archive: archivePath(target, root) });
    console.log(`Backup written: ${archive}\n  database dump ${manifest.database.size} bytes, ${manifest.objects.length} objects, SHA-256 sums in manifest.json`);
  } finally {
    await settings.stop();
  }
}

main().then(
  () => process.exit(0),
  (error: unknown) => {
    console.error(`Backup failed: ${(error as Error).message}`);
    process.exit(1);
  },
);
