import { z } from 'zod';

// zod compiles fast object parsers with `new Function` when it may; the app's
// Content-Security-Policy forbids eval (script-src 'self'), so ask it not to try (it would
// otherwise probe, and the probe alone is reported as a policy violation). Imported first by main.tsx.
z.config({ jitless: true });
