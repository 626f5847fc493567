import { EXIT, type CliIo } from './io.ts';
import { USAGE } from './usage.ts';

export { EXIT, type CliIo } from './io.ts';
export { USAGE } from './usage.ts';

/**
 * Run one CLI invocation; returns the exit code. Never throws on user input. Each command's module is
 * loaded when it runs: `--help` starts without the engine, and `check` without the printouts' renderer.
 */
export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = argv;
  switch (command) {
    case 'check':
      return (await import('./check.ts')).checkCommand(rest, io, USAGE);
    case 'compound':
      return (await import('./compound.ts')).compound(rest, io);
    case 'print':
      return (await import('./print.ts')).print(rest, io);
    case undefined:
    case '-h':
    case '--help':
    case 'help':
      io.stdout(USAGE);
      return command === undefined ? EXIT.invalid : EXIT.ok;
    default:
      io.stderr(`osmocount: unknown command "${command}"\n\n${USAGE}`);
      return EXIT.invalid;
  }
}
