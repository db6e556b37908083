import 'server-only';
import { createHash } from 'node:crypto';

/** A stable UUID (version 5 layout) from a name, so the demo's records keep their ids on every seed. */
export function demoId(name: string): string {
  const hex = createHash('sha1').update(`fallbook-demo:${name}`).digest('hex');
  const variant = ((parseInt(hex.slice(16, 17), 16) & 0x3) | 0x8).toString(16);
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-5${hex.slice(13, 16)}-${variant}${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}
