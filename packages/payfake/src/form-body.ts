/**
 * The payment SDK sends bodies as application/x-www-form-urlencoded with bracketed keys
 * (`line_items[0][price_data][unit_amount]=1500`, `metadata[invoiceId]=7`): decoded here into nested objects,
 * numbered keys into arrays.
 */
export type FormValue = string | FormObject | FormValue[];
export interface FormObject {
  [key: string]: FormValue;
}

function keyPath(raw: string): string[] {
  const first = raw.indexOf('[');
  if (first === -1) return [raw];
  const parts = [raw.slice(0, first)];
  for (const match of raw.slice(first).matchAll(/\[([^\]]*)\]/g)) parts.push(match[1] ?? '');
  return parts;
}

function arraysFromNumberedKeys(value: FormValue): FormValue {
  if (typeof value === 'string' || Array.isArray(value)) return value;
  const keys = Object.keys(value);
  for (const key of keys) value[key] = arraysFromNumberedKeys(value[key]!);
  if (keys.length > 0 && keys.every((key) => /^\d+$/.test(key))) {
    return keys.sort((a, b) => Number(a) - Number(b)).map((key) => value[key]!);
  }
  return value;
}

export function decodeFormBody(body: string): FormObject {
  const root: FormObject = {};
  for (const [rawKey, value] of new URLSearchParams(body)) {
    const path = keyPath(rawKey);
    let node: FormObject = root;
    path.forEach((part, index) => {
      const key = part === '' ? String(Object.keys(node).length) : part;
      if (index === path.length - 1) {
        node[key] = value;
        return;
      }
      const next = node[key];
      if (next === undefined || typeof next === 'string' || Array.isArray(next)) node[key] = {};
      node = node[key] as FormObject;
    });
  }
  return arraysFromNumberedKeys(root) as FormObject;
}

/** A query string's `lookup_keys[]=a&lookup_keys[]=b` and `limit=3`, decoded the same way. */
export function decodeQuery(search: string): FormObject {
  return decodeFormBody(search.startsWith('?') ? search.slice(1) : search);
}
