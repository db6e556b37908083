import 'server-only';
import type { NextRequest } from 'next/server';
import type { z } from 'zod';
import { invalid } from '../errors';

/** The request's JSON body parsed by the schema; a body that is not JSON is a clear 422. */
export async function parseJsonBody<T extends z.ZodType>(req: NextRequest, schema: T): Promise<z.output<T>> {
  let body: unknown;
  try {
    body = await req.json();
  } catch {
    throw invalid('The request body must be JSON.');
  }
  return schema.parse(body);
}
