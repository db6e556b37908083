// zod for code that also runs in the browser: `import * as z from '@/lib/shared/zod'`, not from 'zod'.
// Everything is re-exported by name, not as zod's own `z` object: the bundler then keeps only what the
// schemas use (zod's `z` object holds every locale and the JSON Schema tools, about 57 kB gzipped
// on a capture page).
import { config } from 'zod';
import { plainIssueMessage } from './field-messages';

// The CSP forbids eval. zod probes `new Function` when its first object schema is built (to
// compile fast parsers); the probe's error is caught, but the browser still reports a CSP
// violation. jitless skips the probe in the browser; the server keeps the compiled parsers.
if (typeof window !== 'undefined') config({ jitless: true });

// Where a schema gives no message of its own, a person still reads a plain sentence naming the field
// (metric here; the phone's forms pass the advisor's units per parse).
config({ customError: (issue) => plainIssueMessage(issue) });

export * from 'zod';
