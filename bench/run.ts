// `npm run bench`: every bench/*.bench.ts in turn; each prints its own ratios against a baseline measured in the same run.
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { stopBenchServer } from './support/server';

const here = import.meta.dirname;
const only = process.argv[2];
for (const file of readdirSync(here).filter((f) => f.endsWith('.bench.ts')).sort()) {
  if (only && !file.includes(only)) continue;
  console.log(`\n## ${file.replace('.bench.ts', '')}`);
  const mod = await import(pathToFileURL(join(here, file)).href);
  await mod.default();
}
await stopBenchServer();
