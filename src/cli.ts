#!/usr/bin/env tsx
/** The `partsmith` command. Everything lives in src/cli/; this file only runs it. */
import { runCli } from './cli/main.js';

// A closed pipe (`partsmith ... | head`) is a normal way for output to end.
process.stdout.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EPIPE') process.exit(0);
  throw error;
});

process.exitCode = await runCli(process.argv.slice(2));
