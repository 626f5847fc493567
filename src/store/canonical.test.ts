import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { canonicalJson, contentHash, sameContent } from './canonical.ts';

describe('canonical JSON and content hash', () => {
  it('sorts keys at every level and keeps array order', () => {
    expect(canonicalJson({ b: [2, { d: 1, c: 0 }], a: 'x' })).toBe('{"a":"x","b":[2,{"c":0,"d":1}]}');
    expect(sameContent({ a: 1, b: 2 }, { b: 2, a: 1 })).toBe(true);
    expect(sameContent([1, 2], [2, 1])).toBe(false);
  });

  it('hashes the canonical text with SHA-256, as the reference implementation in node:crypto does', async () => {
    // FIPS 180-2 Appendix B.1 test vector, through node:crypto: SHA-256("abc") = ba7816bf…f20015ad.
    expect(createHash('sha256').update('abc').digest('hex')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    const value = { version: 1, format: 'osmocount-order', lines: [{ product: 'dextrose-70', amount: '150' }] };
    expect(await contentHash(value)).toBe(createHash('sha256').update(canonicalJson(value)).digest('hex'));
  });

  it('gives the same hash to the same content in another key order, and another hash to other content', async () => {
    const a = await contentHash({ products: [{ id: 'x', name: 'X' }], format: 'osmocount-catalog' });
    const b = await contentHash({ format: 'osmocount-catalog', products: [{ name: 'X', id: 'x' }] });
    const c = await contentHash({ format: 'osmocount-catalog', products: [{ name: 'Y', id: 'x' }] });
    expect(a).toBe(b);
    expect(a).not.toBe(c);
    expect(a).toMatch(/^[0-9a-f]{64}$/);
  });
});
