// `npm run bench:<name>`: runs bench/<name>.ts with tsx. Benchmarks print
// ratios against a reference measured in the same run (see docs/benchmarks.md).
import { existsSync } from 'node:fs';
import { bin, run } from './lib/run';

const [name, ...rest] = process.argv.slice(2);
const file = `bench/${name}.ts`;
if (!name || !existsSync(file)) {
  console.error(`No benchmark ${file}.`);
  process.exit(2);
}
process.exit(await run(bin('tsx'), [file, ...rest]));
