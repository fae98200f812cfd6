/**
 * `npm run backup [folder]`: a consistent snapshot of the database and the uploaded files into a
 * dated folder under `folder` (default ./backups), safe to run while the server serves.
 */
import { join, resolve } from 'node:path';
import { writeBackup } from '~/server/backup/backup-snapshot';
import { ConfigError, dataDirFor, parseConfig } from '~/server/config';

async function main() {
  const config = parseConfig(process.env);
  if (!config.DATABASE_URL.startsWith('file:')) throw new ConfigError('npm run backup copies a local database file; DATABASE_URL is not a file: URL. Back up a libSQL server with its own tools.');
  const parent = resolve(process.argv[2] ?? 'backups');
  const { dir, manifest } = await writeBackup(
    { dbPath: resolve(config.DATABASE_URL.slice('file:'.length)), uploadsDir: resolve(config.UPLOADS_DIR), authSecretPath: join(dataDirFor(config.DATABASE_URL), 'auth-secret') },
    parent,
  );
  console.log(`Backup written to ${dir}`);
  console.log(`  ${manifest.revisions} revisions, ${manifest.files} files (${manifest.storedFiles} stored, ${(manifest.storedBytes / 1024 / 1024).toFixed(1)} MiB), integrity ok`);
  console.log(`  restore with: npm run restore ${dir}`);
}

main().catch((err) => {
  console.error(err instanceof ConfigError ? err.message : `The backup failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
