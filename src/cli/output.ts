import type { Report } from '../core/report.ts';
import { reportTable } from './table.ts';

/** Where checked reports go, one at a time, as they are checked (nothing is held but the last JSON report). */
export interface ReportWriter {
  write(report: Report): void;
  /** Close the output (the JSON array's closing bracket). */
  end(): void;
}

/** Readable tables, a blank line apart. */
export function tableWriter(out: (text: string) => void): ReportWriter {
  let any = false;
  return {
    write(r) {
      out(any ? `\n${reportTable(r)}` : reportTable(r));
      any = true;
    },
    end() {},
  };
}

const indent = (json: string) => json.replace(/^/gm, '  ');

/**
 * JSON: one report as an object, several as an array (as `JSON.stringify(reports, null, 2)` would
 * print them), written as they come: only the latest report is held back, to know whether a comma
 * or the closing bracket follows it.
 */
export function jsonWriter(out: (text: string) => void): ReportWriter {
  let held: Report | null = null;
  let opened = false;
  return {
    write(r) {
      if (held !== null) {
        if (!opened) out('[');
        opened = true;
        out(`${indent(JSON.stringify(held, null, 2))},`);
      }
      held = r;
    },
    end() {
      if (!opened) {
        out(held === null ? '[]' : JSON.stringify(held, null, 2));
        return;
      }
      if (held !== null) out(indent(JSON.stringify(held, null, 2)));
      out(']');
    },
  };
}

/** NDJSON: one report per line, compact. */
export function ndjsonWriter(out: (text: string) => void): ReportWriter {
  return { write: (r) => out(JSON.stringify(r)), end: () => {} };
}
