// Checks an S3 presigned URL's signature (AWS Signature V4, query form) with node:crypto, independently
// of the SDK that made it: s3rver checks a URL's expiry but not its V4 signature, so the tests do.
import { createHash, createHmac } from 'node:crypto';

const hmac = (key: Buffer | string, data: string) => createHmac('sha256', key).update(data).digest();
const encode = (s: string) => encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);

/** True when the URL's X-Amz-Signature is the V4 signature of a GET of that URL with the secret key. */
export function presignedUrlIsValid(href: string, secretAccessKey: string): boolean {
  const url = new URL(href);
  const q = url.searchParams;
  if (q.get('X-Amz-Algorithm') !== 'AWS4-HMAC-SHA256' || q.get('X-Amz-SignedHeaders') !== 'host') return false;
  const amzDate = q.get('X-Amz-Date') ?? '';
  const scope = (q.get('X-Amz-Credential') ?? '').split('/').slice(1).join('/');
  const [day = '', region = '', service = ''] = scope.split('/');
  const query = [...q.entries()]
    .filter(([k]) => k !== 'X-Amz-Signature')
    .map(([k, v]) => `${encode(k)}=${encode(v)}`)
    .sort()
    .join('&');
  const canonical = ['GET', url.pathname, query, `host:${url.host}`, '', 'host', 'UNSIGNED-PAYLOAD'].join('\n');
  const toSign = ['AWS4-HMAC-SHA256', amzDate, scope, createHash('sha256').update(canonical).digest('hex')].join('\n');
  const key = hmac(hmac(hmac(hmac(`AWS4${secretAccessKey}`, day), region), service), 'aws4_request');
  return hmac(key, toSign).toString('hex') === q.get('X-Amz-Signature');
}
