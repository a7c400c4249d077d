import { parseArgs } from 'node:util';
import { z } from 'zod';

/**
 * `pnpm bench -- --locations 200 --years 5`: the generated network's size (default 40 × 2).
 * `--reuse` keeps the generated database in the temp folder for the next run of
 * the same size; `--samples` is how many timed requests each screen gets after its warm-up (200:
 * with 40, the p95 of a screen of a few milliseconds moved by 20–50 % from one run to the next).
 */
export function benchOptions(argv = process.argv.slice(2)) {
  const { values } = parseArgs({
    args: argv.filter((a) => a !== '--'),
    options: {
      locations: { type: 'string', default: '40' },
      years: { type: 'string', default: '2' },
      samples: { type: 'string', default: '200' },
      seconds: { type: 'string', default: '10' },
      reuse: { type: 'boolean', default: false },
      results: { type: 'string', default: 'bench/RESULTS.md' },
    },
  });
  return z
    .object({
      locations: z.coerce.number().int().min(1).max(1000),
      years: z.coerce.number().min(0.1).max(10),
      samples: z.coerce.number().int().min(5).max(1000),
      seconds: z.coerce.number().min(1).max(300),
      reuse: z.boolean(),
      results: z.string(),
    })
    .parse(values);
}
export type BenchOptions = ReturnType<typeof benchOptions>;
