import { z } from 'zod';

/**
 * Runs in the browser before any of the app's code. zod compiles object parsers with `new Function`
 * unless told not to; under the pages' Content-Security-Policy (no 'unsafe-eval') its probe for
 * that is reported as a violation. The browser parses small forms, so the interpreted path costs
 * nothing noticeable; the server keeps the compiled one.
 */
z.config({ jitless: true });
