#!/usr/bin/env node
// The package bin. `npm install` compiles the CLI into node_modules/.kvar-ledger-cli (the `prepare` script), and the
// bin runs that: starting without compiling TypeScript takes about a fifth of the time. When a
// source file is newer than the compiled copy (a contributor's edit), or there is none, it runs
// the TypeScript sources through tsx, a runtime dependency, as before; so does
// KVAR_LEDGER_FROM_SOURCE=1 (tests compare the two).
import { existsSync, readdirSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const srcDir = fileURLToPath(new URL('..', import.meta.url));
const compiled = fileURLToPath(new URL('../../node_modules/.kvar-ledger-cli/cli/main.js', import.meta.url));

function newestSource(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = `${dir}/${entry.name}`;
    if (entry.isDirectory()) newest = Math.max(newest, newestSource(path));
    else if (entry.name.endsWith('.ts')) newest = Math.max(newest, statSync(path).mtimeMs);
  }
  return newest;
}

const fresh =
  process.env.KVAR_LEDGER_FROM_SOURCE !== '1' &&
  existsSync(compiled) &&
  statSync(compiled).mtimeMs >= newestSource(srcDir);
if (!fresh) {
  const { register } = await import('tsx/esm/api');
  register();
}
const { main, processIo, guardPipes } = await import(fresh ? compiled : './main.ts');
guardPipes();
process.exitCode = await main(process.argv.slice(2), processIo);
