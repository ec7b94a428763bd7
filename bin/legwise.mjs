#!/usr/bin/env node
// The `legwise` command: runs the bundled CLI (dist-cli/legwise.mjs, built by `npm ci` through
// the `prepare` script, or by `npm run build:cli`). No TypeScript loader at run time.
import { existsSync } from 'node:fs';
import process from 'node:process';
import { URL } from 'node:url';

const bundle = new URL('../dist-cli/legwise.mjs', import.meta.url);
if (!existsSync(bundle)) {
  process.stderr.write(
    'legwise: the command is not built yet (dist-cli/legwise.mjs is missing); run "npm run build:cli" once\n',
  );
  process.exit(3);
}
const { main } = await import(bundle.href);
main();
