// zod for code that also runs in the browser: import `z` from here, not from 'zod'.
import { z } from 'zod';
import { plainIssueMessage } from './field-messages';

// The CSP forbids eval. zod probes `new Function` when its first object schema is built (to
// compile fast parsers); the probe's error is caught, but the browser still reports a CSP
// violation. jitless skips the probe in the browser; the server keeps the compiled parsers.
if (typeof window !== 'undefined') z.config({ jitless: true });

// Where a schema gives no message of its own, a person still reads a plain sentence naming the field
// (metric here; the phone's forms pass the advisor's units per parse).
z.config({ customError: (issue) => plainIssueMessage(issue) });

export { z };
