#!/usr/bin/env node
// The installable `gleaner` command: runs the built command-line runner in dist-cli/.
import { existsSync } from 'node:fs';

const entry = new URL('../dist-cli/main.js', import.meta.url);
if (!existsSync(entry)) {
  process.stderr.write('gleaner: the command-line runner is not built yet; run "npm run build:cli" first (or use "npm run cli -- ...")\n');
  process.exit(1);
}
await import(entry.href);
