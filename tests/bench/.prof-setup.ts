// scratch: prepare a bench DB and print cookie + paths (not committed)
import { copyFileSync, mkdirSync, writeFileSync } from 'node:fs';
import setup from '../setup/global-setup';
import { DEMO, TEMPLATE_DB } from '../helpers/paths';
import { addBigVenue } from './big-venue';
setup();
mkdirSync('/tmp/tl/prof', { recursive: true });
const dbPath = '/tmp/tl/prof/bench.db';
copyFileSync(TEMPLATE_DB, dbPath);
const big = await addBigVenue(dbPath, DEMO.manager);
const { createClient } = await import('@libsql/client');
const db = createClient({ url: `file:${dbPath}` });
await db.execute('UPDATE search_index_state SET version = 0');
db.close();
writeFileSync('/tmp/tl/prof/big', big);
console.log('big venue', big);
