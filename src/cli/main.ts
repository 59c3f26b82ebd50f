import { runApply } from './apply-command';
import { runInspect } from './inspect-command';
import { runCli } from './run';
import { runRunCommand } from './run-command';
import { runSweep } from './sweep-command';

// Entry of the command-line runner (`npm run cli -- ...`, and the built bin/gleaner.js).
const argv = process.argv.slice(2);
process.exitCode = argv[0] === 'inspect' ? await runInspect(argv.slice(1))
  : argv[0] === 'sweep' ? await runSweep(argv.slice(1))
  : argv[0] === 'run' ? await runRunCommand(argv.slice(1))
  : argv[0] === 'apply' ? await runApply(argv.slice(1))
  : await runCli(argv);
