// Bundles the CLI, the language server and the VS Code client to CommonJS with esbuild.
import { readFileSync } from 'node:fs';
import { build } from 'esbuild';

const { version } = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8'));

const quiet = process.argv.includes('--quiet');
const common = {
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  // The packaged extension ships without source maps to stay small.
  sourcemap: !process.argv.includes('--production'),
  minify: process.argv.includes('--production'),
  logLevel: quiet ? 'error' : 'info',
  define: { RECTILENS_VERSION: JSON.stringify(version) },
};

await Promise.all([
  build({ ...common, entryPoints: ['server/src/cli/main.ts'], outfile: 'dist/cli.js', banner: { js: '#!/usr/bin/env node' } }),
  build({ ...common, entryPoints: ['server/src/lsp/main.ts'], outfile: 'dist/server.js' }),
  // The language server's analysis thread, started by dist/server.js and by `rectilens lsp` in dist/cli.js.
  build({ ...common, entryPoints: ['server/src/lsp/analysis-worker.ts'], outfile: 'dist/analysis-worker.js' }),
  // The `check` command's worker threads, started by dist/cli.js (`check --jobs N`).
  build({ ...common, entryPoints: ['server/src/cli/check-worker.ts'], outfile: 'dist/check-worker.js' }),
  build({ ...common, entryPoints: ['client/src/extension.ts'], outfile: 'dist/client.js', external: ['vscode'] }),
  ...(process.argv.includes('--bench') ? [build({ ...common, entryPoints: ['bench/run.ts'], outfile: 'dist/bench.js', external: ['odex'] })] : []),
]);
