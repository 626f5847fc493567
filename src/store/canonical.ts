// Content identity for stored files: the same JSON content gives the same text and the same hash,
// whatever the key order or whitespace of the file it came from.

/**
 * JSON text with object keys sorted at every level (arrays keep their order). Values that JSON cannot
 * hold (undefined, functions) are dropped as JSON.stringify drops them.
 */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(sortKeys(value)) ?? 'null';
}

function sortKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(sortKeys);
  if (value !== null && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const key of Object.keys(value).sort()) out[key] = sortKeys((value as Record<string, unknown>)[key]);
    return out;
  }
  return value;
}

/** Two JSON values hold the same content (key order ignored). */
export function sameContent(a: unknown, b: unknown): boolean {
  return canonicalJson(a) === canonicalJson(b);
}

/**
 * SHA-256 of the canonical JSON, as lowercase hex (Web Crypto; present in browsers and Node ≥ 20).
 * Example: contentHash({ b: 1, a: 2 }) === contentHash({ a: 2, b: 1 }).
 */
export async function contentHash(value: unknown): Promise<string> {
  const bytes = new TextEncoder().encode(canonicalJson(value));
  const digest = await crypto.subtle.digest('SHA-256', bytes);
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** The first characters of a hash, for display ("3f2a9c1e"). */
export function shortHash(hash: string): string {
  return hash.slice(0, 8);
}
