import { describe, expect, test } from 'vitest';
import { SPECIES_IDS, speciesRecord, speciesRow } from './species.ts';

describe('speciesRecord', () => {
  test('holds every species, in SPECIES_IDS order, each with its own value', () => {
    const record = speciesRecord(SPECIES_IDS.map((_, i) => i));
    expect(Object.keys(record)).toEqual([...SPECIES_IDS]);
    expect(Object.values(record)).toEqual(SPECIES_IDS.map((_, i) => i));
  });
});

describe('speciesRow', () => {
  test('gives a record\'s values in SPECIES_IDS order, and undoes speciesRecord', () => {
    const record = Object.fromEntries(SPECIES_IDS.map((s, i) => [s, i * 10])) as Record<(typeof SPECIES_IDS)[number], number>;
    expect(speciesRow(record)).toEqual(SPECIES_IDS.map((_, i) => i * 10));
    expect(speciesRecord(speciesRow(record))).toEqual(record);
  });
});
