// For a command that validates one job and exits (`check`): zod compiles a fast parser for each
// object schema at its first parse, which costs more than it saves on one job's few hundred rows.
// zod reads this setting as it builds each object schema, so the command line imports this module
// before the command's own (src/program.ts): a static import would not do, as the bundle
// (scripts/bundle.mjs) may run the modules a chunk imports before the chunk's own code.
import { z } from 'zod';

z.config({ jitless: true });
