import { describe, expect, it } from 'vitest';
import { restoreFile } from './restore.ts';
import { validCatalogFile, validOrderFile, validPolicyFile } from './validate.ts';
import { DEFAULT_CATALOG, DEFAULT_FILES, DEMO_ORDERS } from '../defaults.ts';

const demo = DEMO_ORDERS[0]!.file as Record<string, unknown>;

describe('restoreFile: one door for every file, with its format version', () => {
  it('passes a v1 order unchanged (as a copy, never the caller’s object)', () => {
    const r = restoreFile(demo, 'order');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.from).toBe('v1');
    expect(r.value.file).toEqual(demo);
    expect(r.value.file).not.toBe(demo);
    expect(r.value.notes).toEqual([]);
  });

  it('reads an unversioned order (no format, no version) as v1 and labels it', () => {
    const { format: _f, version: _v, ...bare } = demo;
    const r = restoreFile(bare);
    expect(r.ok && r.value.kind).toBe('order');
    if (!r.ok) return;
    expect(r.value.from).toBe('unversioned');
    expect(r.value.file.format).toBe('osmocount-order');
    expect(r.value.file.version).toBe(1);
    expect('format' in bare).toBe(false); // input untouched
    const v = validOrderFile(bare, DEFAULT_CATALOG);
    expect(v.ok).toBe(true);
  });

  it('migrates the pre-release v0 order layout field by field, and the result checks like the v1 file', () => {
    const v0 = {
      format: 'osmocount-order', version: 0, id: 'MPH-V0-1',
      patient: { id: 'MRN-1 (fictional)', weight: 68, ageGroup: 'adult' },
      route: 'peripheral', bagMl: 2000, hours: 24,
      items: [
        { product: 'dextrose-70', amount: 150, unit: 'g' },
        { product: 'sodium-chloride-4', amount: 60, unit: 'mEq' },
        { product: 'sterile-water', qs: true },
      ],
    };
    const r = restoreFile(v0, 'order');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.from).toBe('v0');
    expect(r.value.file).toEqual({
      format: 'osmocount-order', version: 1, id: 'MPH-V0-1',
      patient: { id: 'MRN-1 (fictional)', weightKg: 68, ageGroup: 'adult' },
      route: 'peripheral', volumeMl: 2000, hours: 24,
      lines: [
        { product: 'dextrose-70', amount: 150, unit: 'g' },
        { product: 'sodium-chloride-4', amount: 60, unit: 'mEq' },
        { product: 'sterile-water', fill: true },
      ],
    });
    expect(r.value.notes).toContain('items read as lines');
    expect(v0.items[2]).toEqual({ product: 'sterile-water', qs: true }); // input untouched
    expect(validOrderFile(v0, DEFAULT_CATALOG).ok).toBe(true);
  });

  it('keeps the v1 spelling when a v0 file carries both, and says so', () => {
    const r = restoreFile({ format: 'osmocount-order', version: 0, id: 'X', bagMl: 1000, volumeMl: 1500, lines: [] }, 'order');
    expect(r.ok && r.value.file.volumeMl).toBe(1500);
    expect(r.ok && r.value.notes).toContain('bagMl ignored: volumeMl is also present');
  });

  it('refuses a newer version with a message that says why', () => {
    const r = restoreFile({ ...demo, version: 2 }, 'order');
    expect(r).toEqual({ ok: false, problems: [{ path: 'version', message: 'is 2: the file was written by a newer Osmocount; this one reads version 1' }] });
  });

  it('refuses a wrong kind, an unknown format, a non-object and an unrecognisable object', () => {
    expect(restoreFile(DEFAULT_FILES.catalog, 'order')).toEqual({ ok: false, problems: [{ path: 'format', message: 'is a catalog file ("osmocount-catalog"); expected an order file' }] });
    expect(restoreFile({ format: 'something-else' })).toMatchObject({ ok: false, problems: [{ path: 'format' }] });
    expect(restoreFile([demo], 'order')).toMatchObject({ ok: false, problems: [{ path: '(file)', message: expect.stringContaining('not an array') }] });
    expect(restoreFile('text')).toMatchObject({ ok: false, problems: [{ path: '(file)' }] });
    expect(restoreFile({ hello: 1 })).toMatchObject({ ok: false, problems: [{ path: '(file)' }] });
    expect(restoreFile({ ...demo, version: '1' }, 'order')).toMatchObject({ ok: false, problems: [{ path: 'version' }] });
    expect(restoreFile({ ...(DEFAULT_FILES.catalog as object), version: 0 }, 'catalog')).toEqual({ ok: false, problems: [{ path: 'version', message: 'must be 1' }] });
  });

  it('reads unversioned catalogs and policies, and the shipped files as they are', () => {
    const { format: _f, version: _v, ...catalog } = DEFAULT_FILES.catalog as Record<string, unknown>;
    const c = validCatalogFile(catalog);
    expect(c.ok && c.value.from).toBe('unversioned');
    const { format: _pf, version: _pv, ...policy } = DEFAULT_FILES.policy as Record<string, unknown>;
    const p = validPolicyFile(policy);
    expect(p.ok && p.value.from).toBe('unversioned');
    expect(validCatalogFile(DEFAULT_FILES.catalog).ok).toBe(true);
    expect(validPolicyFile(DEFAULT_FILES.policy).ok).toBe(true);
  });

  it('lists every schema problem of a migrated file with its path', () => {
    const r = validOrderFile({ format: 'osmocount-order', version: 0, id: '', patient: { id: 'P', weight: -1, ageGroup: 'adult' }, route: 'side', items: [] }, DEFAULT_CATALOG);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const paths = r.problems.map((p) => p.path);
    expect(paths).toEqual(expect.arrayContaining(['id', 'patient.weightKg', 'route']));
  });
});
