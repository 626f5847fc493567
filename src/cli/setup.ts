import { parseCatalog, type Catalog } from '../core/catalog.ts';
import { parsePolicy, type Policy } from '../core/policy.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../defaults.ts';
import { formatFileProblem, type FileProblem } from './inputs.ts';
import { readError, type CliIo } from './io.ts';

async function readJson(io: CliIo, file: string, problems: FileProblem[]): Promise<unknown> {
  let text: string;
  try {
    text = await io.readFile(file);
  } catch (e) {
    problems.push({ file, where: '', problem: { path: '(file)', message: `cannot be read (${readError(e)})` } });
    return undefined;
  }
  try {
    return JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    problems.push({ file, where: '', problem: { path: '(file)', message: `is not valid JSON (${(e as Error).message})` } });
    return undefined;
  }
}

/** Load --catalog and --policy (or the shipped defaults); null when either is invalid (problems printed). */
export async function loadSetup(io: CliIo, catalogPath: string | undefined, policyPath: string | undefined): Promise<{ catalog: Catalog; policy: Policy } | null> {
  const problems: FileProblem[] = [];
  let catalog = DEFAULT_CATALOG;
  let policy = DEFAULT_POLICY;
  if (catalogPath) {
    const json = await readJson(io, catalogPath, problems);
    if (json !== undefined) {
      const r = parseCatalog(json);
      if (r.ok) catalog = r.value;
      else problems.push(...r.problems.map((problem) => ({ file: catalogPath, where: '', problem })));
    }
  }
  if (policyPath) {
    const json = await readJson(io, policyPath, problems);
    if (json !== undefined) {
      const r = parsePolicy(json);
      if (r.ok) policy = r.value;
      else problems.push(...r.problems.map((problem) => ({ file: policyPath, where: '', problem })));
    }
  }
  if (problems.length > 0) {
    for (const p of problems) io.stderr(formatFileProblem(p));
    io.stderr('The catalog or policy is invalid: no order was checked.');
    return null;
  }
  return { catalog, policy };
}
