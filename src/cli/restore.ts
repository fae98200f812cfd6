/**
 * `npm run restore <backup folder>`: brings a backup back into an empty data folder and uploads
 * folder (DATABASE_URL and UPLOADS_DIR say where). Refuses a folder that already holds anything.
 */
import { resolve } from 'node:path';
import { restoreBackup, RestoreRefused } from '~/server/backup/restore-backup';
import { ConfigError, parseConfig } from '~/server/config';

async function main() {
  const config = parseConfig(process.env);
  const backup = process.argv[2];
  if (!backup) throw new ConfigError('Say which backup to restore: npm run restore backups/throwline-YYYYMMDD-HHMMSS');
  if (!config.DATABASE_URL.startsWith('file:')) throw new ConfigError('npm run restore writes a local database file; DATABASE_URL is not a file: URL.');
  const dbPath = resolve(config.DATABASE_URL.slice('file:'.length));
  const manifest = await restoreBackup(backup, { dbPath, uploadsDir: resolve(config.UPLOADS_DIR) });
  console.log(`Restored the backup of ${manifest.createdAt} into ${dbPath} and ${resolve(config.UPLOADS_DIR)}`);
  console.log(`  ${manifest.revisions} revisions, ${manifest.files} files, integrity ok. Start the server with npm start.`);
}

main().catch((err) => {
  console.error(err instanceof ConfigError || err instanceof RestoreRefused ? err.message : `The restore failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
