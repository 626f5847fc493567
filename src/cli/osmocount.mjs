#!/usr/bin/env node
// Launcher for `npx osmocount`: runs the CLI bundle that `npm install` builds (npm run build:cli).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const bundle = fileURLToPath(new URL('../../dist/cli/osmocount.mjs', import.meta.url));
if (!existsSync(bundle)) {
  process.stderr.write('osmocount: the CLI is not built yet. Run `npm run build:cli` (npm install does it) and try again.\n');
  process.exit(2);
}
await import(bundle);
