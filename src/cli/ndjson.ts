import { createInterface } from 'node:readline';
import type { Readable } from 'node:stream';
import { invalid, type InputItem } from './inputs.ts';
import { readError } from './io.ts';

/**
 * The orders of an NDJSON stream, one JSON object per line, read line by line through
 * node:readline: only the current line (and readline's small read-ahead) is held, so memory stays
 * flat however long the file is. A line that is not JSON is an invalid item naming its line
 * (`line 7`); blank lines are skipped; `\r\n` endings and a leading byte-order mark are accepted.
 * Stops reading (and closes the stream) when the caller stops iterating.
 */
export async function* ndjsonItems(file: string, input: Readable): AsyncGenerator<InputItem> {
  const lines = createInterface({ input, crlfDelay: Infinity });
  let n = 0;
  try {
    for await (const raw of lines) {
      n += 1;
      const line = n === 1 ? raw.replace(/^\uFEFF/, '') : raw;
      if (line.trim() === '') continue;
      let value: unknown;
      try {
        value = JSON.parse(line);
      } catch (e) {
        yield invalid(file, `line ${n}`, '(line)', `is not valid JSON (${(e as Error).message})`);
        continue;
      }
      yield { kind: 'order', order: { file, where: `line ${n}`, value } };
    }
  } catch (e) {
    yield invalid(file, n === 0 ? '' : `after line ${n}`, '(file)', `cannot be read to its end (${readError(e)}); the rest of the file was not checked`);
  } finally {
    lines.close();
    input.destroy();
  }
}
