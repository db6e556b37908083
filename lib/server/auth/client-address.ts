import 'server-only';

type Headers = Record<string, string | string[] | undefined> | undefined;

/**
 * The address a sign-in came from, for the per-address limit: the LAST X-Forwarded-For entry.
 * Next sets the header to the socket's address only when the request has none, and a proxy
 * appends the peer it saw, so only the last entry was written by something other than the
 * client; the first is whatever the client sent (taking it let one machine spread its failures
 * over made-up addresses). Behind a proxy, have it set or append X-Forwarded-For (README).
 */
export function clientAddress(headers: Headers): string {
  const forwarded = headers?.['x-forwarded-for'];
  const list = (Array.isArray(forwarded) ? forwarded.join(',') : forwarded ?? '').split(',');
  return list[list.length - 1]?.trim().slice(0, 64) || 'local';
}
