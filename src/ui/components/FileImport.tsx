import type { Problem } from '../../core/problems.ts';

/** Read a chosen file as JSON; a file that is not JSON gives one `(file)` problem, never a throw. */
export async function readJsonFile(file: File): Promise<{ ok: true; value: unknown } | { ok: false; problems: Problem[] }> {
  const text = await file.text();
  try {
    return { ok: true, value: JSON.parse(text) as unknown };
  } catch (e) {
    return { ok: false, problems: [{ path: '(file)', message: `${file.name} is not valid JSON (${e instanceof Error ? e.message : String(e)})` }] };
  }
}

/** A button-looking label around a file input: opens the file chooser and hands over the parsed JSON. */
export function FileImport({ label, onJson, onProblems }: { label: string; onJson(value: unknown, name: string): void; onProblems(p: Problem[]): void }) {
  return (
    <label className="button file-button">
      {label}
      <input
        type="file"
        className="sr-only"
        accept=".json,application/json"
        onChange={async (e) => {
          const input = e.currentTarget;
          const file = input.files?.[0];
          if (!file) return;
          const r = await readJsonFile(file);
          input.value = '';
          if (r.ok) onJson(r.value, file.name);
          else onProblems(r.problems);
        }}
      />
    </label>
  );
}
