#!/usr/bin/env node
// Thin launcher: the commands are compiled from cli/ into dist/ by `npm ci` (the prepare script).
// Ctrl-C is answered (exit code 130) from the first moment, before the commands have loaded.
import { holdSignals } from '../dist/cli/signals.js';

holdSignals();
const { main } = await import('../dist/cli/main.js');

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code; },
  (err) => {
    console.error(`tidewright: ${err instanceof Error ? err.message : String(err)}`);
    process.exitCode = 2;
  },
);
