import { describe, expect, it } from 'vitest';
import { DEFAULT_FILES } from '../../defaults.ts';
import { fileProducts, formFieldOf, formFromProduct, productFromForm, withProduct } from './productForm.ts';

describe('the stock form', () => {
  it('round-trips every shipped stock: the saved catalog equals the shipped one', () => {
    const products = fileProducts(DEFAULT_FILES.catalog);
    let file: unknown = DEFAULT_FILES.catalog;
    products.forEach((p, i) => {
      const r = withProduct(file, i, productFromForm(formFromProduct(p), p));
      expect(r.result.ok).toBe(true);
      file = r.file;
    });
    const a = withProduct(DEFAULT_FILES.catalog, 0, products[0] as Record<string, unknown>).result;
    const b = withProduct(file, 0, fileProducts(file)[0] as Record<string, unknown>).result;
    if (!a.ok || !b.ok) throw new Error('invalid');
    expect(b.value.products.map((p) => [p.id, p.particlePerMl.toString(), p.mOsmPerMl?.toString(), p.salts.length, Object.keys(p.sources).length]))
      .toEqual(a.value.products.map((p) => [p.id, p.particlePerMl.toString(), p.mOsmPerMl?.toString(), p.salts.length, Object.keys(p.sources).length]));
  });

  it('reports problems with the file format\'s paths, mapped back to the form fields', () => {
    const form = { ...formFromProduct(fileProducts(DEFAULT_FILES.catalog)[7]), 'perMl.Na': '-4', 'perMl.K': 'x' };
    const r = withProduct(DEFAULT_FILES.catalog, 7, productFromForm(form, undefined)).result;
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual(expect.arrayContaining([
      { path: 'products[7].perMl.Na', message: 'must be a number ≥ 0 and ≤ 100' },
      { path: 'products[7].perMl.K', message: 'must be a number ≥ 0 and ≤ 100' },
    ]));
    expect(formFieldOf('products[7].perMl.Na', 7)).toBe('perMl.Na');
    expect(formFieldOf('products[17].perMl.Na', 7)).toBeNull();
  });
});
