// Every JSON route in app/api, found from the route files themselves (as the authorization matrix
// finds routes): each exported handler whose wrapper names a body schema, `{ body: schema, maxBytes? }`,
// with that schema and limit loaded from the module the route imports them from.
import fs from 'node:fs';
import path from 'node:path';
import type { z } from 'zod';
import { DEFAULT_MAX_BODY_BYTES } from '@/lib/http/route';

const ROOT = path.resolve(import.meta.dirname, '../..');
const API = path.join(ROOT, 'app/api');

type Handler = (req: Request, ctx: { params: Promise<any> }) => Promise<Response>;

export type JsonRoute = {
  /** "POST /api/series/:seriesId/gags" */
  route: string;
  method: string;
  file: string;
  /** The route's path parameters, in order. */
  params: string[];
  schemaName: string;
  schema: z.ZodType;
  maxBytes: number;
  handler: Handler;
};

function routeFiles(dir = API): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return routeFiles(full);
    return e.name === 'route.ts' ? [full] : [];
  });
}

/** Where an identifier used in a route file comes from: '@/lib/validation/pass' → an absolute path. */
function importedFrom(file: string, source: string, name: string): string | null {
  for (const m of source.matchAll(/import\s*(?:type\s*)?\{([^}]*)\}\s*from\s*'([^']+)'/g)) {
    const names = m[1]!.split(',').map((s) =>
      s
        .trim()
        .replace(/^type\s+/, '')
        .split(/\s+as\s+/)
        .pop(),
    );
    if (names.includes(name)) return m[2]!.startsWith('@/') ? path.join(ROOT, m[2]!.slice(2)) : path.resolve(path.dirname(file), m[2]!);
  }
  return null;
}

/** A mutating handler that takes no JSON body, and why. The test fails on one not listed here or as a JSON route. */
export const BODYLESS: Record<string, string> = {
  'POST /api/series/:seriesId/uploads': 'multipart upload',
  'POST /api/gags/:gagId/final-pages': 'multipart upload',
  'POST /api/volumes/:volumeId/entries/:entryId/final-pages': 'multipart upload',
  'POST /api/final-pages/:finalPageId/current': 'the final page is in the path',
  'POST /api/invitations/:token/accept': 'the token is the whole request',
  'POST /api/series/:seriesId/invitations/:invitationId/resend': 'the invitation is in the path',
  'POST /api/passes/:passId/revisions/:revisionId/restore': 'the revision is in the path',
  'POST /api/auth/:...nextauth': "next-auth's own form endpoints",
};

export type Discovery = { routes: JsonRoute[]; unresolved: string[]; withoutBody: string[] };

export async function discoverJsonRoutes(): Promise<Discovery> {
  const routes: JsonRoute[] = [];
  const unresolved: string[] = [];
  const withoutBody: string[] = [];
  for (const file of routeFiles().sort()) {
    const source = fs.readFileSync(file, 'utf8');
    const rel = path.relative(API, path.dirname(file));
    const segments = rel.split(path.sep).map((seg) => seg.replace(/^\[(.+)\]$/, ':$1'));
    const url = '/api/' + segments.join('/');
    const params = segments.filter((s) => s.startsWith(':') && !s.startsWith(':...')).map((s) => s.slice(1));
    // Each export's text runs to the next export (or the end of the file).
    const exports = [...source.matchAll(/export (?:const|async function) (GET|POST|PUT|PATCH|DELETE)\b/g)];
    for (const [i, m] of exports.entries()) {
      const method = m[1]!;
      const route = `${method} ${url}`;
      const text = source.slice(m.index, exports[i + 1]?.index ?? source.length);
      const spec = /\{\s*body:\s*([A-Za-z_$][\w$]*)\s*(?:,\s*maxBytes:\s*([A-Za-z_$][\w$]*|[\d_]+)\s*)?\}/.exec(text);
      if (!spec) {
        if (method !== 'GET' && method !== 'DELETE' && !BODYLESS[route]) withoutBody.push(route);
        continue;
      }
      const schemaName = spec[1]!;
      const from = importedFrom(file, source, schemaName);
      const mod = from ? ((await import(from)) as Record<string, unknown>) : null;
      const schema = mod?.[schemaName] as z.ZodType | undefined;
      if (!schema) {
        unresolved.push(`${route}: ${schemaName} (export it from a lib/validation module)`);
        continue;
      }
      let maxBytes = DEFAULT_MAX_BODY_BYTES;
      if (spec[2]) {
        if (/^[\d_]+$/.test(spec[2])) maxBytes = Number(spec[2].replace(/_/g, ''));
        else {
          const limitFrom = importedFrom(file, source, spec[2]);
          const value = limitFrom ? ((await import(limitFrom)) as Record<string, unknown>)[spec[2]] : undefined;
          if (typeof value !== 'number') {
            unresolved.push(`${route}: maxBytes ${spec[2]}`);
            continue;
          }
          maxBytes = value;
        }
      }
      const handler = ((await import(file)) as Record<string, Handler>)[method]!;
      routes.push({ route, method, file, params, schemaName, schema, maxBytes, handler });
    }
  }
  return { routes, unresolved, withoutBody };
}
