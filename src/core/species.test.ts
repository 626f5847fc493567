import { describe, expect, test } from 'vitest';
import { SPECIES_IDS, speciesRecord } from './species.ts';

describe('speciesRecord', () => {
  test('holds every species, in SPECIES_IDS order, each with its own value', () => {
    const record = speciesRecord(SPECIES_IDS.map((_, i) => i));
    expect(Object.keys(record)).toEqual([...SPECIES_IDS]);
    expect(Object.values(record)).toEqual(SPECIES_IDS.map((_, i) => i));
  });
});
