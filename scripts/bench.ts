// npm run bench: runs every benchmark in bench/ in turn and prints its report.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const only = process.argv[2];
const files = fs
  .readdirSync('bench')
  .filter((f) => f.endsWith('.bench.ts') && (!only || f.includes(only)))
  .sort();
let failed = 0;
for (const f of files) {
  console.log(`\n=== ${f}`);
  const r = spawnSync(process.execPath, ['--import', 'tsx', '--expose-gc', path.join('bench', f)], {
    stdio: 'inherit',
  });
  if (r.status !== 0) failed++;
}
process.exit(failed ? 1 : 0);
