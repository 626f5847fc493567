import { checkCommand, CHECK_USAGE } from './check.ts';
import { compound } from './compound.ts';
import { print } from './print.ts';
import { EXIT, type CliIo } from './io.ts';

export { EXIT, type CliIo } from './io.ts';
export { loadSetup } from './setup.ts';

const COMPOUND_USAGE = `  osmocount compound FILE... [--catalog FILE] [--policy FILE] [--json]
      Allocate each order's ion block: the electrolyte lines it adds (volumes rounded to
      measurable increments), delivered vs ordered for every ion, problems with proposals,
      and the suggested mixing sequence. Exit 0: every order met; 1: any order cannot be
      met as written; 2: any input invalid or without an ion block.
      (check allocates an order's ion block first, then checks the bag.)`;

const PRINT_USAGE = `  osmocount print FILE... --sheet|--label --out DIR [--catalog FILE] [--policy FILE]
        [--institution NAME] [--paper a4|letter] [--label-size 4x6|4x4|WxHin|WxHmm]
        [--compounded ISO-TIME] [--time-zone ZONE]
      Write each order's verification sheet (ORDER.sheet.html) and/or bag label (ORDER.label.html)
      into DIR as self-contained HTML (styles and barcode inline) for printing. --compounded is
      the compounding time the beyond-use dates count from (default now), read in --time-zone
      (default the system's) unless it carries an offset. Exit codes as for check.`;

const COMMON_OPTIONS = `Options for every command:
  --catalog FILE   stock catalog (default: the shipped data/catalog.json)
  --policy FILE    institution policy (default: the shipped data/policy.json)
  -h, --help       this text`;

/** The help text: one block per command (add a command's block here), then the shared options. */
export const USAGE = ['Usage:', CHECK_USAGE, COMPOUND_USAGE, PRINT_USAGE, '', COMMON_OPTIONS].join('\n');

/** Run one CLI invocation; returns the exit code. Never throws on user input. */
export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = argv;
  switch (command) {
    case 'check':
      return checkCommand(rest, io, USAGE);
    case 'compound':
      return compound(rest, io);
    case 'print':
      return print(rest, io);
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
