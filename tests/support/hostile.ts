// Hostile request bodies: a body the route's schema allows, then changed the way an attacker would —
// a value of the wrong type or far out of range, NaN-ish and Infinity-ish text, NUL and lone
// surrogates, over-long strings, prototype keys (__proto__, constructor), extra and missing keys,
// deep nesting, duplicate keys, broken JSON and UTF-8, the wrong media type or another site's Origin.
// Ids of other series come in through the `ids` pool, both inside valid bodies and as stray values.
import fc from 'fast-check';

/** A number or fragment JSON.stringify cannot write (1e999 parses to Infinity, -0 keeps its sign). */
class Raw {
  constructor(readonly text: string) {}
}

export type HostileBody = {
  /** What was done to the body, for failure messages and the per-kind tally. */
  kind: string;
  body: string | Uint8Array<ArrayBuffer>;
  contentType: string | null;
  origin?: string;
};

type Path = (string | number)[];

const NASTY_STRINGS = [
  '\u0000',
  'a\u0000b',
  '\ud800',
  '\udfff',
  'x\ud83dy',
  '\u202egnp.exe',
  '\ufeff',
  '😀'.repeat(40),
  'e\u0301\u0301\u0301\u0301',
  "' OR '1'='1",
  "'; DROP TABLE users; --",
  '../../../../etc/passwd',
  '<script>alert(1)</script>',
  '=HYPERLINK("http://evil.test","x")',
  '%00',
  '\r\n\r\n',
  ' '.repeat(10),
  '\u0000'.repeat(10),
  'A'.repeat(121),
  'A'.repeat(4001),
];
const NAN_ISH = [
  'NaN',
  'Infinity',
  '-Infinity',
  '1e999',
  '-0',
  '0x1F',
  '1_000',
  ' 42 ',
  '4 2',
  'null',
  'undefined',
  'true',
  '[]',
  '{}',
  '2027-02-30',
];
const NUMBERS: unknown[] = [
  1e308,
  -1e308,
  Number.MAX_VALUE,
  Number.MIN_VALUE,
  2 ** 53 + 2,
  -(2 ** 53) - 2,
  2 ** 64,
  0.1 + 0.2,
  1.5,
  -1,
  new Raw('1e999'),
  new Raw('-1e999'),
  new Raw('1e-999'),
  new Raw('-0'),
  new Raw('123456789012345678901234567890'),
];
const WRONG_TYPES: unknown[] = [null, true, false, 0, '', [], {}, [null], { 0: 0 }, [[[]]]];
const PROTO_KEYS = ['__proto__', 'constructor', 'prototype', 'toString', 'hasOwnProperty', 'valueOf'];
const EXTRA_KEYS = ['isAdmin', 'role', 'seriesId', 'userId', 'authorId', 'id', 'createdAt', 'status', 'seq', 'x'];
const WHOLE_BODIES = [
  '',
  ' ',
  'null',
  'true',
  '0',
  '"a string"',
  '[]',
  '[{}]',
  '{',
  '{"a":1,}',
  "{'a':1}",
  '{"a":1}{"b":2}',
  '\ufeff{}',
  '{"__proto__":{"isAdmin":true}}',
  '{"constructor":{"prototype":{"isAdmin":true}}}',
  'NaN',
  '1e999',
];
const CONTENT_TYPES = [
  'text/plain',
  'application/x-www-form-urlencoded',
  'multipart/form-data; boundary=x',
  'application/json; charset=utf-16',
  'APPLICATION/JSON',
  null,
];

/** Any UTF-16 code unit, lone surrogates included. */
const anyCodeUnits = fc.string({ unit: fc.integer({ min: 0, max: 0xffff }).map((c) => String.fromCharCode(c)), maxLength: 30 });

export function hostileValue(ids: string[]): fc.Arbitrary<unknown> {
  return fc.oneof(
    fc.constantFrom(...WRONG_TYPES),
    fc.constantFrom(...NUMBERS),
    fc.constantFrom(...NAN_ISH),
    fc.constantFrom(...NASTY_STRINGS),
    ...(ids.length ? [fc.constantFrom(...ids)] : []),
    anyCodeUnits,
    fc.jsonValue({ maxDepth: 3 }),
  );
}

/** JSON text for a value that may hold Raw fragments and own `__proto__` keys. */
export function toJsonText(value: unknown): string {
  const raws: string[] = [];
  const text = JSON.stringify(value, (_key, v: unknown) => {
    if (v instanceof Raw) {
      raws.push(v.text);
      return `__raw_${raws.length - 1}__`;
    }
    return v;
  });
  return (text ?? 'null').replace(/"__raw_(\d+)__"/g, (_m, i: string) => raws[Number(i)]!);
}

/** Every path into the value (the root first), at most `limit` of them. */
export function pathsOf(value: unknown, limit = 300): Path[] {
  const out: Path[] = [];
  const walk = (v: unknown, p: Path) => {
    if (out.length >= limit) return;
    out.push(p);
    if (Array.isArray(v)) v.forEach((x, i) => walk(x, [...p, i]));
    else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) walk(x, [...p, k]);
  };
  walk(value, []);
  return out;
}

const isObject = (v: unknown): v is Record<string, unknown> => !!v && typeof v === 'object' && !Array.isArray(v);

/** A copy with `at` replaced by `to` (own property, so "__proto__" is a key, not the prototype). */
function setAt(value: unknown, at: Path, to: unknown): unknown {
  if (at.length === 0) return to;
  const copy: unknown = Array.isArray(value) ? [...value] : { ...(value as object) };
  const [head, ...rest] = at;
  const next = setAt((value as Record<string | number, unknown>)[head!], rest, to);
  Object.defineProperty(copy, head!, { value: next, enumerable: true, writable: true, configurable: true });
  return copy;
}

function getAt(value: unknown, at: Path): unknown {
  return at.reduce<unknown>((v, k) => (v as Record<string | number, unknown>)?.[k], value);
}

function dropAt(value: unknown, at: Path): unknown {
  if (at.length === 0) return value;
  const parent = getAt(value, at.slice(0, -1));
  const key = at[at.length - 1]!;
  if (Array.isArray(parent))
    return setAt(
      value,
      at.slice(0, -1),
      parent.filter((_, i) => i !== key),
    );
  const rest = { ...(parent as object) } as Record<string, unknown>;
  delete rest[key as string];
  return setAt(value, at.slice(0, -1), rest);
}

const json = (kind: string, body: string): HostileBody => ({ kind, body, contentType: 'application/json' });
const pick = <T>(xs: T[], i: number): T => xs[i % xs.length]!;

/**
 * Bodies for one route: `valid` (from the route's schema) as it is, and changed in each of the ways above.
 * `ids` holds real ids of this series and of others.
 */
export function hostileBodies(valid: fc.Arbitrary<unknown>, ids: string[]): fc.Arbitrary<HostileBody> {
  const value = hostileValue(ids);
  const asIs = valid.map((v) => json('schema', toJsonText(v)));
  const replaced = fc.tuple(valid, fc.nat(), value).map(([v, i, h]) => {
    const paths = pathsOf(v);
    const at = pick(paths.length > 1 ? paths.slice(1) : paths, i);
    return json('value', toJsonText(setAt(v, at, h)));
  });
  const extraKey = fc
    .tuple(valid, fc.nat(), fc.constantFrom(...PROTO_KEYS, ...EXTRA_KEYS), fc.oneof(value, fc.constant({ isAdmin: true })))
    .map(([v, i, k, h]) => {
      const objects = pathsOf(v).filter((p) => isObject(getAt(v, p)));
      if (!objects.length) return json('extra key', toJsonText(setAt({}, [k], h)));
      const at = pick(objects, i);
      return json(PROTO_KEYS.includes(k) ? 'prototype key' : 'extra key', toJsonText(setAt(v, [...at, k], h)));
    });
  const missing = fc.tuple(valid, fc.nat()).map(([v, i]) => {
    const paths = pathsOf(v).slice(1);
    return json('missing key', toJsonText(paths.length ? dropAt(v, pick(paths, i)) : v));
  });
  const whole = fc.oneof(fc.constantFrom(...WHOLE_BODIES), value.map(toJsonText)).map((text) => json('whole body', text));
  const deep = fc.tuple(valid, fc.nat(), fc.constantFrom(64, 1_000, 20_000, 40_000), fc.boolean()).map(([v, i, depth, arrays]) => {
    const paths = pathsOf(v);
    const nest = arrays ? '['.repeat(depth) + ']'.repeat(depth) : '{"a":'.repeat(depth) + '1' + '}'.repeat(depth);
    return json('deep nesting', toJsonText(setAt(v, pick(paths, i), new Raw(nest))));
  });
  const long = fc
    .tuple(valid, fc.nat(), fc.constantFrom(1_000, 10_000, 70_000, 1_100_000), fc.constantFrom('x', '\u0000', '😀'))
    .map(([v, i, n, c]) => {
      const strings = pathsOf(v).filter((p) => typeof getAt(v, p) === 'string');
      const at = strings.length ? pick(strings, i) : pick(pathsOf(v), i);
      return json('long string', toJsonText(setAt(v, at, c.repeat(n))));
    });
  const duplicateKey = fc.tuple(valid, value).map(([v, h]) => {
    const text = toJsonText(v);
    const first = isObject(v) ? Object.keys(v)[0] : undefined;
    if (!first || !text.startsWith('{')) return json('duplicate key', text);
    return json('duplicate key', `{${JSON.stringify(first)}:${toJsonText(h)},${text.slice(1)}`);
  });
  const brokenUtf8 = fc.tuple(valid, fc.constantFrom([0xff], [0xc0, 0x80], [0xed, 0xa0, 0x80], [0xf8, 0x88, 0x80, 0x80, 0x80])).map(([v, bad]) => {
    const bytes = Buffer.from(toJsonText(v));
    // Inside the first string value if there is one, else at the front.
    const at = Math.max(0, bytes.indexOf(Buffer.from(':"')) + 2);
    return {
      kind: 'broken utf-8',
      body: new Uint8Array(Buffer.concat([bytes.subarray(0, at), Buffer.from(bad), bytes.subarray(at)])),
      contentType: 'application/json',
    };
  });
  const headers = fc
    .tuple(valid, fc.constantFrom(...CONTENT_TYPES), fc.boolean())
    .map(([v, contentType, crossSite]) =>
      crossSite
        ? { kind: 'other origin', body: toJsonText(v), contentType: 'application/json', origin: 'https://evil.test' }
        : { kind: 'media type', body: toJsonText(v), contentType },
    );
  return fc.oneof(
    { weight: 4, arbitrary: asIs },
    { weight: 6, arbitrary: replaced },
    { weight: 2, arbitrary: extraKey },
    { weight: 1, arbitrary: missing },
    { weight: 1, arbitrary: whole },
    { weight: 1, arbitrary: deep },
    { weight: 1, arbitrary: long },
    { weight: 1, arbitrary: duplicateKey },
    { weight: 1, arbitrary: brokenUtf8 },
    { weight: 1, arbitrary: headers },
  );
}
