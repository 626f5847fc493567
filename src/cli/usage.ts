// The help text, apart from the commands: `osmocount --help` loads this and nothing of the engine.

export const CHECK_USAGE = `  osmocount check PATH... [--catalog FILE] [--policy FILE] [--json | --ndjson]
                  [--only VERDICT[,VERDICT]] [--fail-on warn|block]
      Check PN orders, then print a summary: orders by verdict, findings that warn or hold
      by code, and the ten highest osmolarities on peripheral bags.
      A PATH is a file or a directory, searched recursively for *.json, *.ndjson, *.jsonl
      and *.csv. A .json file holds one order or an array of orders; .ndjson and .jsonl
      one order per line (streamed); .csv one row per order line (streamed), with the
      columns order_id, patient_id, weight_kg, age_group, route, volume_ml, product,
      amount, unit and, if wanted, hours, species, fill, patient_name, location, note,
      order_note (see the README for the layout).
      --json            reports as JSON: one object, or an array when there are several
      --ndjson          reports as NDJSON, one line per order, written as they are checked
                        (with --json or --ndjson the summary goes to stderr, so stdout
                        stays valid JSON)
      --only VERDICTS   print only orders with these verdicts: pass, warn, block (or hold),
                        comma-separated or repeated; the summary still counts every order
      --fail-on LEVEL   exit 1 when any order is at this verdict or worse: warn, or block
                        (the default)
      Exit 0: no order reached --fail-on; 1: some order did; 2: an input was invalid. Each
      problem is printed on stderr as file: where: path: message (where = [index], line N
      or row N), and every valid order is still checked and reported.`;

export const COMPOUND_USAGE = `  osmocount compound FILE... [--catalog FILE] [--policy FILE] [--json]
      Allocate each order's ion block: the electrolyte lines it adds (volumes rounded to
      measurable increments), delivered vs ordered for every ion, problems with proposals,
      and the suggested mixing sequence. Exit 0: every order met; 1: any order cannot be
      met as written; 2: any input invalid or without an ion block.
      (check allocates an order's ion block first, then checks the bag.)`;

export const PRINT_USAGE = `  osmocount print FILE... --sheet|--label --out DIR [--catalog FILE] [--policy FILE]
        [--institution NAME] [--paper a4|letter] [--label-size 4x6|4x4|WxHin|WxHmm]
        [--compounded ISO-TIME] [--time-zone ZONE]
      Write each order's verification sheet (ORDER.sheet.html) and/or bag label (ORDER.label.html)
      into DIR as self-contained HTML (styles and barcode inline) for printing. --compounded is
      the compounding time the beyond-use dates count from (default now), read in --time-zone
      (default the system's) unless it carries an offset. Exit codes as for check.`;

export const COMMON_OPTIONS = `Options for every command:
  --catalog FILE   stock catalog (default: the shipped data/catalog.json)
  --policy FILE    institution policy (default: the shipped data/policy.json)
  -h, --help       this text`;

/** The help text: one block per command (add a command's block here), then the shared options. */
export const USAGE = ['Usage:', CHECK_USAGE, COMPOUND_USAGE, PRINT_USAGE, '', COMMON_OPTIONS].join('\n');
