/**
 * Migrates the database and, on an empty one with SEED_DEMO=1, seeds the demo venues.
 * Run by `npm start` before the server starts, and by the test setup for its template database.
 */
import { openDb } from '~/db/client';
import { runMigrations } from '~/db/migrate';
import { ConfigError, getConfig } from '~/server/config';
import { ensureSearchIndex } from '~/server/search-index';

async function main() {
  const config = getConfig();
  const db = await openDb(config.DATABASE_URL);
  await runMigrations(db);
  // Before any server process starts, so the workers of a cluster do not all rebuild at once.
  await ensureSearchIndex(db);
  if (!config.SEED_DEMO) {
    db.$client.close();
    return;
  }
  const { seedDemo } = await import('~/server/demo/seed');
  const result = await seedDemo(db, config.DEMO_PASSWORD);
  if (result.seeded) {
    console.log('Seeded the demo venues. Demo accounts (demo only — never use these on a real instance):');
    for (const a of result.accounts) console.log(`  ${a.email.padEnd(28)} ${a.role}`);
    if (result.guestLink) console.log(`Demo guest pass (shown only now): ${result.guestLink}`);
    console.log(`  password: the DEMO_PASSWORD setting${process.env.DEMO_PASSWORD ? '' : ' (default "throwline-demo")'}`);
    if (config.SEED_DEMO_PHOTOS) {
      const { seedDemoPhotos } = await import('~/server/demo/seed-photos');
      const { demoPeople, demoVenues } = await import('~/server/demo/seed-data');
      const added = await seedDemoPhotos(demoVenues[0].slug, demoPeople.engineer.email);
      console.log(`  ${added} demo drawings uploaded into ${config.UPLOADS_DIR}`);
      const { seedDemoTraces } = await import('~/server/demo/seed-traces');
      const traces = await seedDemoTraces(demoVenues[0].slug, demoPeople.engineer.email);
      console.log(`  ${traces} demo measurement traces (invented) attached to the processing page`);
    }
  }
  db.$client.close();
}

main().catch((err) => {
  console.error(err instanceof ConfigError ? err.message : err);
  process.exit(1);
});
