// Loaded into a server process with NODE_OPTIONS=--import, it records which of React's builds
// the process has run (React picks `*.production.js` or `*.development.js` when first
// required). Only observes: it writes REACT_PROBE_DIR/<pid>.json and changes nothing served.
// Node's ESM loader parses (without running) both files named in React's index.js to learn their
// export names, so both appear in the cache; only the one that ran has `loaded` set.
import { writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';

const require = createRequire(import.meta.url);
const out = process.env.REACT_PROBE_DIR;
let seen = 0;
if (out) {
  setInterval(() => {
    const loaded = Object.entries(require.cache)
      .filter(([path, module]) => module?.loaded && /[\\/]react(-dom)?[\\/]cjs[\\/]/.test(path))
      .map(([path]) => path);
    if (loaded.length === seen) return;
    seen = loaded.length;
    writeFileSync(join(out, `${process.pid}.json`), JSON.stringify(loaded));
  }, 50).unref();
}
