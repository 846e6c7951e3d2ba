// Bundles the extension with esbuild. The grammar and the licence live once, at the top of the
// repository; the package takes copies of them here, so there is nothing to keep in step.
//   node build.mjs               development build (source maps)
//   node build.mjs --production  minified, as packaged by vsce
//   node build.mjs --tests       also the unit tests, into out/test
import { copyFile, mkdir } from 'node:fs/promises';
import * as esbuild from 'esbuild';

const production = process.argv.includes('--production');
const tests = process.argv.includes('--tests');

await mkdir('syntaxes', { recursive: true });
await copyFile('../../grammar/windingnotes.tmLanguage.json', 'syntaxes/windingnotes.tmLanguage.json');
await copyFile('../../LICENSE', 'LICENSE');

const common = { bundle: true, platform: 'node', format: 'cjs', target: 'node20', logLevel: 'warning' };

await esbuild.build({
  ...common,
  entryPoints: ['src/extension.ts'],
  outfile: 'dist/extension.js',
  external: ['vscode'],
  minify: production,
  sourcemap: !production,
});

if (tests) {
  await esbuild.build({ ...common, entryPoints: ['test/server.test.ts'], outdir: 'out/test' });
}
