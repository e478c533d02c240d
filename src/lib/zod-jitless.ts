import { z } from 'zod';

// zod 4 probes whether it may compile parsers with `new Function("")`. Under our CSP (no
// 'unsafe-eval') the probe fails quietly, but the browser still reports an `eval` violation on every
// page. jitless skips the probe and the compiled parsers (our schemas are small; the interpreter is
// fast enough). Imported first in main.tsx: a schema built before this would already have probed.
z.config({ jitless: true });
