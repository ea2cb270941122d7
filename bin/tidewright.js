#!/usr/bin/env node
// Thin launcher: the commands are compiled from cli/ into dist/ by `npm ci` (the prepare script).
import { main } from '../dist/cli/main.js';

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code; },
  (err) => {
    console.error(`tidewright: ${err instanceof Error ? err.message : String(err)}`);
    process.exitCode = 2;
  },
);
