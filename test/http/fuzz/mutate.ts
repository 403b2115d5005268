/**
 * Mutations of a valid body into hostile or broken ones. Each plan is drawn
 * by fast-check; the mutation works on a deep copy, and some work on the
 * JSON text itself (duplicated keys, truncation, over-long numbers, deep
 * nesting), since JSON.stringify cannot produce those.
 */
import fc from 'fast-check';

export type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

export interface Mutated {
  text: string;
  contentType: string | undefined;
}

const HOSTILE_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty', 'valueOf', '__defineGetter__', ''];

/** Values that have broken parsers and numeric code before. */
export const specialValue: fc.Arbitrary<Json> = fc.oneof(
  fc.constantFrom<Json>(0, -0, 1e308, -1e308, 5e-324, 2 ** 53 + 1, -(2 ** 31), 1e21, 0.1, -1, 1e-300, 4294967296),
  fc.constantFrom<Json>('', '1', '1e3', 'NaN', 'Infinity', '-0', ' 2 ', 'true', 'null', '\u0000', '\ud800', '😀🏭', 'ﷺ', '\u202eevil', 'a'.repeat(5000)),
  fc.constantFrom<Json>(null, true, false, [], {}, [[]], [null], [1, '2', null], { kind: 'transfer-function' }),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer(),
  fc.string({ maxLength: 40, unit: 'binary' }),
  fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { maxLength: 80 }),
  fc.jsonValue({ maxDepth: 3 }) as fc.Arbitrary<Json>,
);

/** Every [container, key] inside a value, in a stable order. */
function slots(root: Json): [Json[] | Record<string, Json>, string | number][] {
  const out: [Json[] | Record<string, Json>, string | number][] = [];
  const stack: Json[] = [root];
  while (stack.length) {
    const v = stack.pop()!;
    if (Array.isArray(v)) v.forEach((x, i) => (out.push([v, i]), stack.push(x)));
    else if (v && typeof v === 'object') for (const k of Object.keys(v)) (out.push([v, k]), stack.push(v[k]));
  }
  return out;
}

function objects(root: Json): Record<string, Json>[] {
  const out: Record<string, Json>[] = [];
  if (root && typeof root === 'object' && !Array.isArray(root)) out.push(root);
  for (const [c, k] of slots(root)) {
    const v = (c as Record<string | number, Json>)[k];
    if (v && typeof v === 'object' && !Array.isArray(v)) out.push(v);
  }
  return out;
}

const CONTENT_TYPES = ['text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'application/xml', '', 'application/json; charset=utf-8', 'APPLICATION/JSON', 'application/json-patch+json'];

export const OPS = [
  'valid',
  'replace',
  'replace',
  'replace',
  'delete',
  'hostile-key',
  'duplicate-key',
  'truncate',
  'content-type',
  'deep-nesting',
  'long-number',
  'stringify-number',
  'grow-array',
  'random-body',
  'wrap',
] as const;
export type Op = (typeof OPS)[number];

export interface Plan {
  op: Op;
  pick: number;
  value: Json;
  size: number;
}

export const planArb: fc.Arbitrary<Plan> = fc.record({
  op: fc.constantFrom(...OPS),
  pick: fc.nat(),
  value: specialValue,
  size: fc.integer({ min: 1, max: 20_000 }),
});

export function mutate(seed: unknown, plan: Plan): Mutated {
  const body = JSON.parse(JSON.stringify(seed)) as Json;
  const json = (text: string): Mutated => ({ text, contentType: 'application/json' });
  const all = slots(body);
  const at = all.length ? all[plan.pick % all.length] : null;
  switch (plan.op) {
    case 'valid':
      return json(JSON.stringify(body));
    case 'replace':
      if (at) (at[0] as Record<string | number, Json>)[at[1]] = plan.value;
      return json(JSON.stringify(at ? body : plan.value));
    case 'delete':
      if (at) {
        if (Array.isArray(at[0])) at[0].splice(at[1] as number, 1);
        else delete at[0][at[1] as string];
      }
      return json(JSON.stringify(body));
    case 'hostile-key': {
      const objs = objects(body);
      const target = objs.length ? objs[plan.pick % objs.length] : null;
      const key = HOSTILE_KEYS[plan.pick % HOSTILE_KEYS.length];
      if (!target) return json(`{"${key}": ${JSON.stringify(plan.value)}}`);
      // defineProperty makes "__proto__" an own key, which JSON.stringify then writes out.
      Object.defineProperty(target, key, { value: key === '__proto__' ? { polluted: true, kind: 'x' } : plan.value, enumerable: true, configurable: true, writable: true });
      return json(JSON.stringify(body));
    }
    case 'duplicate-key': {
      const text = JSON.stringify(body);
      const keys = [...text.matchAll(/"([A-Za-z]+)":/g)];
      if (!keys.length) return json(text);
      const m = keys[plan.pick % keys.length];
      const i = m.index!;
      return json(`${text.slice(0, i)}"${m[1]}":${JSON.stringify(plan.value)},${text.slice(i)}`);
    }
    case 'truncate': {
      const text = JSON.stringify(body);
      return json(text.slice(0, plan.pick % Math.max(1, text.length)));
    }
    case 'content-type':
      return { text: JSON.stringify(body), contentType: plan.pick % 9 === 8 ? undefined : CONTENT_TYPES[plan.pick % CONTENT_TYPES.length] };
    case 'deep-nesting': {
      const depth = plan.size * 10;
      const open = plan.pick % 2 ? '['.repeat(depth) : '{"a":'.repeat(depth);
      const close = plan.pick % 2 ? ']'.repeat(depth) : '}'.repeat(depth);
      const marker = '"__deep__"';
      if (at) (at[0] as Record<string | number, Json>)[at[1]] = '__deep__';
      return json(JSON.stringify(at ? body : '__deep__').replace(marker, `${open}1${close}`));
    }
    case 'long-number': {
      const literals = ['1e999', '-1e999', '1' + '0'.repeat(400), '0.' + '0'.repeat(400) + '1', '123456789012345678901234567890', '-0.0e-0', '1E+308', '2.5e-400'];
      if (at) (at[0] as Record<string | number, Json>)[at[1]] = '__num__';
      return json(JSON.stringify(at ? body : '__num__').replace('"__num__"', literals[plan.pick % literals.length]));
    }
    case 'stringify-number': {
      const nums = all.filter(([c, k]) => typeof (c as Record<string | number, Json>)[k] === 'number');
      if (nums.length) {
        const [c, k] = nums[plan.pick % nums.length];
        (c as Record<string | number, Json>)[k] = String((c as Record<string | number, Json>)[k]);
      }
      return json(JSON.stringify(body));
    }
    case 'grow-array': {
      const arrays = all.filter(([c, k]) => Array.isArray((c as Record<string | number, Json>)[k]));
      if (arrays.length) {
        const [c, k] = arrays[plan.pick % arrays.length];
        const a = (c as Record<string | number, Json>)[k] as Json[];
        const filler = a.length ? a[a.length - 1] : 1;
        (c as Record<string | number, Json>)[k] = Array.from({ length: plan.size }, (_, i) => (typeof filler === 'number' ? filler + i * 1e-3 : filler));
      }
      return json(JSON.stringify(body));
    }
    case 'random-body':
      return json(JSON.stringify(plan.value));
    case 'wrap':
      return json(JSON.stringify(plan.pick % 2 ? [body] : { request: body }));
  }
}
