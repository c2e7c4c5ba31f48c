#!/usr/bin/env node
// The package bin. It runs the TypeScript sources directly (no build step): tsx, a runtime
// dependency, is registered as the module loader first, then the CLI is imported.
import { register } from 'tsx/esm/api';

register();
const { main, processIo, guardPipes } = await import('./main.ts');
guardPipes();
process.exitCode = await main(process.argv.slice(2), processIo);
