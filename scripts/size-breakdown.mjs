// Size breakdown: which modules of dist/ an entry set of scripts/size-budgets.mjs bundles, and how many bytes of
// the minified output each contributes (esbuild's metafile, `bytesInOutput`; before gzip, so the shares are
// approximate). Run after `npm run build`: `node scripts/size-breakdown.mjs "business days"` (the sets whose name
// contains the text; without it, every set), or `node scripts/size-breakdown.mjs -- name1,name2` for a set of
// imports of your own.
import { gzipSync } from 'node:zlib';
import { fileURLToPath } from 'node:url';
import { dirname, relative, resolve } from 'node:path';
import { SETS, bundleImports } from './size-budgets.mjs';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

async function breakdown(name, imports) {
  const result = await bundleImports(imports, { metafile: true });
  const code = result.outputFiles[0].contents;
  const [output] = Object.values(result.metafile.outputs);
  const rows = Object.entries(output.inputs)
    .map(([path, { bytesInOutput }]) => ({ path: relative(root, resolve(root, path)), bytes: bytesInOutput }))
    .filter((r) => r.bytes > 0)
    .sort((a, b) => b.bytes - a.bytes);
  console.log(`\n${name}: ${code.length} B min, ${gzipSync(code, { level: 9 }).length} B min+gz`);
  for (const r of rows) console.log(`  ${String(r.bytes).padStart(7)}  ${r.path}`);
}

const args = process.argv.slice(2);
if (args[0] === '--') await breakdown('your set', args[1].split(','));
else for (const set of SETS.filter((s) => args.length === 0 || s.name.includes(args[0]))) await breakdown(set.name, set.imports);
