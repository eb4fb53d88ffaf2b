#!/usr/bin/env node
// Runs the command line from the TypeScript sources through tsx, with no compile step: what the
// tests and a contributor use (`npm run cli -- <command> …`). The installed command is bin/limnopress.js.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../src/cli/main.ts');
process.exitCode = await main(process.argv.slice(2));
