import { runCli } from './run.ts';
import { nodeIo } from './nodeIo.ts';

// The command-line entry: real files and streams around the in-memory runCli.
// A reader that goes away (`osmocount check … | head`) ends the run quietly.
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
  throw e;
});
process.exitCode = await runCli(process.argv.slice(2), nodeIo());
