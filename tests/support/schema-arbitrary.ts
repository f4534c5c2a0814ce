// fast-check arbitraries for request bodies, from a route's own zod schema. The schema is read through
// zod's JSON Schema export (its public description of the shape, on the output side so formats such as
// e-mail show), so refinements it cannot describe (a real calendar date, "at least one field") are
// left to chance: some generated bodies are valid, some are refused, both are wanted.
import fc from 'fast-check';
import { z } from 'zod';

export type JsonSchema = {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  required?: string[];
  additionalProperties?: boolean | JsonSchema;
  enum?: unknown[];
  const?: unknown;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  minLength?: number;
  maxLength?: number;
  pattern?: string;
  format?: string;
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minItems?: number;
  maxItems?: number;
  items?: JsonSchema | false;
  prefixItems?: JsonSchema[];
  default?: unknown;
};

export function jsonSchemaOf(schema: z.ZodType): JsonSchema {
  return z.toJSONSchema(schema, { io: 'output', unrepresentable: 'any' }) as JsonSchema;
}

// Keys whose strings name another record: "passId", "strokeIds", an entry to move "before" or "after",
// the checklist items "ticked".
const NAMES_A_RECORD = /(^id|Id|Ids)$|^(before|after|ticked)$/;

// A date-shaped pattern (YYYY-MM-DD) gets real calendar dates too, which random digits seldom are.
const DATE_PATTERN = '^\\d{4}-\\d{2}-\\d{2}$';
const realDate = fc
  .date({ min: new Date('2000-01-01T00:00:00Z'), max: new Date('2100-12-31T00:00:00Z'), noInvalidDate: true })
  .map((d) => d.toISOString().slice(0, 10));

export type ArbitraryOptions = {
  /** Ids of the records the request is about (this gag's passes, this volume's entries…). */
  near?: string[];
  /** Any real ids, of this series and of others: a string field that could hold one often gets one. */
  ids?: string[];
  /** Longest array generated inside the schema's own bounds (schemas allow thousands). */
  maxItems?: number;
};

/** Values that satisfy the JSON Schema's own constraints (not the refinements it cannot express). */
export function arbitraryFromSchema(schema: JsonSchema, opts: ArbitraryOptions = {}): fc.Arbitrary<unknown> {
  const maxItems = opts.maxItems ?? 4;
  const near = opts.near ?? [];
  const ids = opts.ids ?? [];

  const of = (s: JsonSchema, key?: string): fc.Arbitrary<unknown> => {
    if ('const' in s) return fc.constant(s.const);
    if (s.enum) return fc.constantFrom(...s.enum);
    const alternatives = s.anyOf ?? s.oneOf;
    if (alternatives) return fc.oneof(...alternatives.map((a) => of(a, key)));
    if (s.allOf?.length) return of(Object.assign({}, ...s.allOf), key);
    if (Array.isArray(s.type)) return fc.oneof(...s.type.map((type) => of({ ...s, type }, key)));
    switch (s.type) {
      case 'null':
        return fc.constant(null);
      case 'boolean':
        return fc.boolean();
      case 'integer':
        return integer(s);
      case 'number':
        return number(s);
      case 'string':
        return string(s, key);
      case 'array':
        return array(s, key);
      case 'object':
        return object(s);
      default:
        return fc.jsonValue({ maxDepth: 2 });
    }
  };

  const integer = (s: JsonSchema) => {
    const min = Math.ceil(s.exclusiveMinimum !== undefined ? s.exclusiveMinimum + 1 : (s.minimum ?? -1_000_000));
    const max = Math.floor(s.exclusiveMaximum !== undefined ? s.exclusiveMaximum - 1 : (s.maximum ?? 1_000_000));
    return fc.integer({ min: Math.max(min, Number.MIN_SAFE_INTEGER), max: Math.min(max, Number.MAX_SAFE_INTEGER) });
  };

  const number = (s: JsonSchema) => {
    const lo = s.exclusiveMinimum ?? s.minimum;
    const hi = s.exclusiveMaximum ?? s.maximum;
    if (lo === undefined && hi === undefined) {
      // Unbounded (coordinates in mm): mostly on and around a page, sometimes anything finite.
      return fc.oneof(
        { weight: 4, arbitrary: fc.double({ min: -20, max: 200, noNaN: true }) },
        { weight: 1, arbitrary: fc.double({ noNaN: true, noDefaultInfinity: true }) },
      );
    }
    return fc.double({
      min: lo ?? -1e6,
      max: hi ?? 1e6,
      minExcluded: s.exclusiveMinimum !== undefined,
      maxExcluded: s.exclusiveMaximum !== undefined,
      noNaN: true,
      noDefaultInfinity: true,
    });
  };

  const string = (s: JsonSchema, key?: string) => {
    const minLength = s.minLength ?? 0;
    const maxLength = s.maxLength ?? 200;
    let base: fc.Arbitrary<string>;
    if (s.pattern === DATE_PATTERN) base = fc.oneof(realDate, fc.stringMatching(new RegExp(s.pattern)));
    else if (s.pattern) base = fc.stringMatching(new RegExp(s.pattern)).filter((x) => x.length >= minLength && x.length <= maxLength);
    else if (s.format === 'email') base = fc.emailAddress();
    else {
      // Mostly plain text, sometimes any Unicode text (the hostile layer adds control characters).
      const bounds = { minLength, maxLength: Math.min(maxLength, minLength + 40) };
      base = fc.oneof(
        { weight: 3, arbitrary: fc.string({ ...bounds, unit: 'grapheme-ascii' }) },
        { weight: 1, arbitrary: fc.string({ ...bounds, unit: 'grapheme' }) },
      );
    }
    const fits = (id: string) => id.length >= minLength && id.length <= maxLength && (!s.pattern || new RegExp(s.pattern).test(id));
    const nearby = near.filter(fits);
    const known = ids.filter(fits);
    // A field that names a record gets real ids most of the time; any other string now and then.
    const naming = key !== undefined && NAMES_A_RECORD.test(key);
    return fc.oneof(
      { weight: naming ? 1 : 4, arbitrary: base },
      ...(nearby.length ? [{ weight: naming ? 3 : 1, arbitrary: fc.constantFrom(...nearby) }] : []),
      ...(known.length ? [{ weight: naming ? 2 : 1, arbitrary: fc.constantFrom(...known) }] : []),
    );
  };

  const array = (s: JsonSchema, key?: string) => {
    if (s.prefixItems) return fc.tuple(...s.prefixItems.map((p) => of(p)));
    const minLength = s.minItems ?? 0;
    const item = s.items ? of(s.items, key) : fc.jsonValue({ maxDepth: 1 });
    return fc.array(item, { minLength, maxLength: Math.min(s.maxItems ?? maxItems, Math.max(minLength, maxItems)) });
  };

  const object = (s: JsonSchema) => {
    const props = s.properties ?? {};
    // A field with a default may be left out by the sender.
    const requiredKeys = (s.required ?? []).filter((k) => props[k] && props[k]!.default === undefined);
    const model = Object.fromEntries(Object.entries(props).map(([k, v]) => [k, of(v, k)]));
    return fc.record(model, { requiredKeys });
  };

  return of(schema);
}
