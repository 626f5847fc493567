import { useState } from 'react';
import { parsePolicy, type Policy, type Rule } from '../../core/policy.ts';
import type { Problem } from '../../core/problems.ts';
import { FileImport } from '../components/FileImport.tsx';
import { ProblemsList } from '../components/ProblemsList.tsx';
import { AGE_GROUP_TEXT, SEVERITY_TEXT } from '../show.ts';

interface Props {
  policy: Policy;
  file: unknown;
  onReplace(file: unknown, policy: Policy, label: string): void;
}

const AGE_KEYS = ['all', 'adult', 'child', 'term-neonate', 'preterm-neonate'] as const;
const ageText = (k: (typeof AGE_KEYS)[number]) => (k === 'all' ? 'All ages' : AGE_GROUP_TEXT[k]);

function isRule(v: unknown): v is Rule {
  return typeof v === 'object' && v !== null && 'severity' in v && 'source' in v;
}

function bound(r: Rule): string {
  const min = r.min === null ? null : `≥ ${r.min.toString()}`;
  const max = r.max === null ? null : `≤ ${r.max.toString()}`;
  return [min, max].filter(Boolean).join(' and ') || '—';
}

/** One table of rules by check (or nutrient) and age group, each with its bound, severity and source. */
function RuleTable({ title, rules }: { title: string; rules: Record<string, unknown> }) {
  const rows = Object.entries(rules).flatMap(([code, byAge]) =>
    AGE_KEYS.flatMap((age) => {
      const rule = (byAge as Record<string, unknown> | null)?.[age];
      return isRule(rule) ? [{ code, age, rule }] : [];
    }));
  return (
    <>
      <h2>{title}</h2>
      <table className="policy-table" aria-label={title}>
        <thead>
          <tr><th scope="col">Check</th><th scope="col">Applies to</th><th scope="col">Limit</th><th scope="col">Unit</th><th scope="col">Severity</th><th scope="col">Source</th></tr>
        </thead>
        <tbody>
          {rows.map(({ code, age, rule }) => (
            <tr key={`${code}-${age}`}>
              <th scope="row" className="code">{code}</th>
              <td>{ageText(age)}</td>
              <td className="num">{bound(rule)}</td>
              <td>{rule.unit}</td>
              <td className={`sev-${rule.severity}`}><span className="sev">{SEVERITY_TEXT[rule.severity]}</span></td>
              <td>{rule.source}{rule.note ? <span className="sub">{rule.note}</span> : null}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}

/** The limits in force, each with its severity and source; import a policy file (invalid → nothing replaced). */
export function PolicyView({ policy, file, onReplace }: Props) {
  const [problems, setProblems] = useState<Problem[]>([]);
  const [notice, setNotice] = useState<string | null>(null);
  const importFile = (json: unknown, name: string) => {
    const r = parsePolicy(json);
    if (!r.ok) { setProblems(r.problems); setNotice(`${name} was not imported: the policy in force is unchanged.`); return; }
    setProblems([]);
    onReplace(json, r.value, `Imported ${name}`);
    setNotice(`Imported ${name}: ${r.value.name}.`);
  };
  const ref = policy.reference;
  const steps = policy.solver;
  return (
    <main className="policy-view" aria-labelledby="policy-title">
      <div className="view-head">
        <h1 id="policy-title">Policy: {policy.name}</h1>
        <span className="muted">id {policy.id}{policy.institution ? ` · ${policy.institution}` : ''}</span>
        <FileImport label="Import policy file…" onJson={importFile} onProblems={(p) => { setProblems(p); setNotice('The file was not imported: the policy in force is unchanged.'); }} />
      </div>
      {notice ? <p className="notice" role="status">{notice}</p> : null}
      <ProblemsList problems={problems} title="Problems in the imported policy" />
      <p>Reported osmolarity: <strong>{policy.reportedOsmolarity === 'higher' ? 'the higher of particle count and label sum' : policy.reportedOsmolarity}</strong> — {policy.reportedOsmolaritySource}</p>
      <RuleTable title="Release checks" rules={policy.rules} />
      <RuleTable title="Dose ranges (per kg per day unless the unit says otherwise)" rules={policy.doseRanges} />
      <h2>Solver steps</h2>
      <p>
        Final volume rounded up to {AGE_KEYS.flatMap((a) => (steps.volumeStepMl[a] ? [`${steps.volumeStepMl[a].toString()} mL (${ageText(a).toLowerCase()})`] : [])).join(', ')};
        dextrose rounded down to {Object.entries(steps.dextroseStep).map(([u, v]) => `${v.toString()} ${u}`).join(', ')} — {steps.source}
      </p>
      <h2>Reference values</h2>
      <dl className="pairs">
        <div><dt>Amino acids per g nitrogen</dt><dd>{ref.gramsAminoAcidPerGramNitrogen.value.toString()} g — {ref.gramsAminoAcidPerGramNitrogen.source}</dd></div>
        <div><dt>Plasma osmolality</dt><dd>{ref.plasmaOsmolality.min.toString()}–{ref.plasmaOsmolality.max.toString()} {ref.plasmaOsmolality.unit} — {ref.plasmaOsmolality.source}</dd></div>
        <div><dt>Osmotic pressure temperature</dt><dd>{ref.osmoticPressureTemperatureC.value.toString()} °C — {ref.osmoticPressureTemperatureC.source}</dd></div>
      </dl>
      <details className="raw">
        <summary>The whole policy file</summary>
        <pre>{JSON.stringify(file, null, 2)}</pre>
      </details>
    </main>
  );
}
