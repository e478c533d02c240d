// npm run lint:deps — the dependency rules of .dependency-cruiser.cjs over src/ and server/.
//
// Runs dependency-cruiser through its public API rather than its `depcruise` command: the command
// refuses Node 20 (its engines say ^22), while the API it wraps runs on Node 20 unchanged.
// Exit code 1 and one line per violation when a rule is broken.
import { createRequire } from 'node:module';
import { cruise } from 'dependency-cruiser';
import extractTSConfig from 'dependency-cruiser/config-utl/extract-ts-config';

const require = createRequire(import.meta.url);
const ruleSet = require('../.dependency-cruiser.cjs');
const { options, ...rules } = ruleSet;

const result = await cruise(
  ['src', 'server'],
  { ...options, validate: true, ruleSet: rules, outputType: 'err' },
  {},
  { tsConfig: extractTSConfig(options.tsConfig.fileName) },
);
process.stdout.write(result.output);
process.exitCode = result.exitCode === 0 ? 0 : 1;
