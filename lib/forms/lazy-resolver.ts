// Forms check their fields with the same zod schemas as the server, but zod and
// the schemas are loaded only when a form is first checked (on submit, or on
// the first keystroke of a live field), not with the page: a page's first
// load carries no validation code.
import type { FieldValues, Resolver } from 'react-hook-form';
import type { ZodType } from 'zod';

/** A react-hook-form resolver for a zod schema that is imported on first use. */
export function lazyZodResolver<T extends FieldValues>(load: () => Promise<ZodType>): Resolver<T> {
  let ready: Promise<Resolver<T>> | null = null;
  return async (values, context, options) => {
    ready ??= Promise.all([load(), import('@hookform/resolvers/zod')]).then(
      ([schema, m]) => m.zodResolver(schema as never) as unknown as Resolver<T>,
    );
    return (await ready)(values, context, options);
  };
}

/** A value loaded once, on first ask (e.g. a schema module for a field checked as people type). */
export function onFirstUse<T>(load: () => Promise<T>): () => Promise<T> {
  let p: Promise<T> | null = null;
  return () => (p ??= load());
}
