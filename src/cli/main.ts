import { runCli } from './run';

// Entry of the command-line runner (`npm run cli -- ...`, and the built bin/gleaner.js).
process.exitCode = await runCli(process.argv.slice(2));
