import { checkCommand, CHECK_USAGE } from './check.ts';
import { EXIT, type CliIo } from './io.ts';

export { EXIT, type CliIo } from './io.ts';
export { loadSetup } from './setup.ts';

const COMMON_OPTIONS = `Options for every command:
  --catalog FILE   stock catalog (default: the shipped data/catalog.json)
  --policy FILE    institution policy (default: the shipped data/policy.json)
  -h, --help       this text`;

/** The help text: one block per command (add a command's block here), then the shared options. */
export const USAGE = ['Usage:', CHECK_USAGE, '', COMMON_OPTIONS].join('\n');

/** Run one CLI invocation; returns the exit code. Never throws on user input. */
export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = argv;
  switch (command) {
    case 'check':
      return checkCommand(rest, io, USAGE);
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
