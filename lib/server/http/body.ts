import 'server-only';
import { unusableJson } from '@/lib/shared/schemas/bounds';
import { invalid, tooLarge } from '../errors';

/** The largest JSON body a form route reads; a sync push has its own, larger cap. */
export const MAX_JSON_BYTES = 1024 * 1024;

/** The request body parsed as JSON, read up to `maxBytes` (413 past it); a body that is not JSON is a 422, not a 500. */
export async function readJson(req: Request, maxBytes = MAX_JSON_BYTES): Promise<unknown> {
  const text = (await readBodyCapped(req, maxBytes, 'The request body')).toString('utf8');
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw invalid('The request body is not valid JSON.');
  }
  // JSON may spell half a character (`"\ud83d"`), which is not text and no column can hold, or
  // name a key `__proto__`, which no field has. Text decoded from UTF-8 holds no half character
  // unless the JSON escapes one (`\u`), and such a key is spelled out or escaped: a body with
  // neither needs no walk through every value.
  const unusable = text.includes('\\u') || text.includes('__proto__') ? unusableJson(value) : null;
  if (unusable) {
    const field = unusable.path.join('.') || '_';
    throw invalid(`${field}: ${unusable.message}`, { [field]: [unusable.message] });
  }
  return value;
}

/**
 * The raw body as one buffer, read chunk by chunk and abandoned past `maxBytes` (413), so a huge
 * upload is never buffered whole. Content-Length is checked first when the client sends it.
 */
export async function readBodyCapped(req: Request, maxBytes: number, what: string): Promise<Buffer> {
  const tooBig = () => tooLarge(`${what} is larger than ${Math.round(maxBytes / 1024 / 1024)} MB.`);
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > maxBytes) throw tooBig();
  if (!req.body) return Buffer.alloc(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooBig();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks, total);
}
