/**
 * Decodes a form-encoded body the way the payment service reads the SDK's requests:
 * `line_items[0][price_data][unit_amount]=4500&metadata[orderId]=7` → nested objects and arrays.
 * Values stay strings (the service converts them per parameter).
 */
export type FormValue = string | FormValue[] | { [key: string]: FormValue };

export function parseForm(body: string): Record<string, FormValue> {
  const root: Record<string, FormValue> = {};
  for (const [rawKey, value] of new URLSearchParams(body)) {
    const first = rawKey.indexOf('[');
    const path = first === -1 ? [rawKey] : [rawKey.slice(0, first), ...[...rawKey.slice(first).matchAll(/\[([^\]]*)\]/g)].map((m) => m[1])];
    let node: Record<string, FormValue> | FormValue[] = root;
    for (let i = 0; i < path.length; i++) {
      const key = path[i];
      const last = i === path.length - 1;
      if (key === '__proto__' || key === 'constructor' || key === 'prototype') break;
      const slot = Array.isArray(node) ? (key === '' ? node.length : Number(key)) : key;
      if (last) {
        (node as Record<string | number, FormValue>)[slot] = value;
      } else {
        const nextIsIndex = /^\d*$/.test(path[i + 1]);
        const existing = (node as Record<string | number, FormValue>)[slot];
        if (existing === undefined || typeof existing === 'string')
          (node as Record<string | number, FormValue>)[slot] = nextIsIndex ? [] : {};
        node = (node as Record<string | number, FormValue>)[slot] as Record<string, FormValue> | FormValue[];
      }
    }
  }
  return root;
}

/** A string parameter, or undefined. */
export function str(v: FormValue | undefined): string | undefined {
  return typeof v === 'string' ? v : undefined;
}

/** A flat string map parameter (metadata), or {}. */
export function strMap(v: FormValue | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  if (v && typeof v === 'object' && !Array.isArray(v)) for (const [k, x] of Object.entries(v)) if (typeof x === 'string') out[k] = x;
  return out;
}
