import 'server-only';
import type { NextRequest } from 'next/server';
import type { z } from 'zod';
import { readJson } from './body';

/** The request's JSON body (at most 1 MB, else 413) parsed by the schema; a body that is not JSON is a clear 422. */
export async function parseJsonBody<T extends z.ZodType>(req: NextRequest, schema: T): Promise<z.output<T>> {
  return schema.parse(await readJson(req));
}
