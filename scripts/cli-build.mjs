// The `twofold` command's compiled JavaScript: cli/main.ts and each command of cli/commands/
// with everything it imports from cli/, core/ and host/, bundled by esbuild into dist/cli/ as
// CommonJS, one file per command (main.cjs requires only the command it runs). npm packages
// other than vega and vega-lite stay outside the bundle and load only when a command requires
// them.
//
// CommonJS, not ES modules, because it starts faster on Node 20: the ES module loader linked
// the chunks and ran every CommonJS package (papaparse, pdfkit, node-forge...) through its
// export scanner first; together about 30 ms of CPU on every `twofold analyze` (interleaved
// runs, docs/performance.md). Code shared by two commands is in both files; a process runs
// one command.
//
// `.npmrc` sets ignore-scripts, so no install step can build it: at every start the bin
// (bin/twofold.cjs, through scripts/cli-start.cjs) stats the files the last build was made
// from (recorded in dist/cli/build.json) and calls buildCli() only when one changed or the
// build is missing. Each build goes to a fresh folder and build.json is replaced by rename, so
// processes that start at the same moment never see half a build.
//
// `node scripts/cli-build.mjs` (npm run build:cli) builds it by hand.
import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import start from './cli-start.cjs';

const { ROOT, OUT, RECORD } = start;
/** Older build folders are removed once they are this old (a running process may still load chunks from one). */
const KEEP_OLD_BUILDS_MS = 60 * 60 * 1000;

const { stamp, readRecord, isCurrent } = start;

function removeOldBuilds(keep) {
  let entries;
  try {
    entries = readdirSync(OUT, { withFileTypes: true });
  } catch {
    return;
  }
  for (const e of entries) {
    if (!e.isDirectory() || e.name === keep) continue;
    const full = join(OUT, e.name);
    const s = stamp(full);
    if (s && Date.now() - s[0] > KEEP_OLD_BUILDS_MS) rmSync(full, { recursive: true, force: true });
  }
}

/**
 * npm packages bundled into the build: vega and vega-lite are some hundred small ES modules
 * whose loading (resolve, read, parse each) took about twice as long as one bundled file, on
 * every report. Every other package stays outside (its own files, loaded when imported).
 */
const BUNDLED_PACKAGES = new Set(['vega', 'vega-lite']);

function externalPackages() {
  const manifest = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8'));
  const names = Object.keys({ ...manifest.dependencies, ...manifest.devDependencies }).filter((n) => !BUNDLED_PACKAGES.has(n));
  return names.flatMap((n) => [n, `${n}/*`]);
}

/**
 * main.ts loads a command with `import('./commands/NAME')`: in the build that is the command's
 * own file, required when the command runs.
 */
const commandsApart = {
  name: 'commands-apart',
  setup(build) {
    build.onResolve({ filter: /^\.\/commands\/[\w-]+$/ }, (args) =>
      args.importer === join(ROOT, 'cli', 'main.ts') ? { path: `${args.path}.cjs`, external: true } : undefined,
    );
  },
};

/**
 * vega-canvas's Node build looks for the optional `canvas` package with a top-level await,
 * which CommonJS cannot hold. Twofold renders SVG without a canvas (the package is not a
 * dependency, so that lookup always found nothing); its browser build is the same code
 * without the lookup, and gives the same charts.
 */
const vegaWithoutCanvas = {
  name: 'vega-without-canvas',
  setup(build) {
    build.onResolve({ filter: /^vega-canvas$/ }, () => ({ path: join(ROOT, 'node_modules', 'vega-canvas', 'build', 'vega-canvas.browser.js') }));
  },
};

/** Bundle the command line now; returns the entry file's path. */
export async function buildCli() {
  const { build } = await import('esbuild');
  const folder = `b${Date.now().toString(36)}-${process.pid}`;
  const outdir = join(OUT, folder);
  const commands = readdirSync(join(ROOT, 'cli', 'commands')).filter((f) => f.endsWith('.ts'));
  const entryPoints = { main: 'cli/main.ts', ...Object.fromEntries(commands.map((f) => [`commands/${f.slice(0, -3)}`, `cli/commands/${f}`])) };
  const result = await build({
    absWorkingDir: ROOT,
    entryPoints,
    outdir,
    bundle: true,
    format: 'cjs',
    platform: 'node',
    target: 'node20',
    external: externalPackages(),
    plugins: [commandsApart, vegaWithoutCanvas],
    // import() becomes require(), so a package loads as CommonJS, without the ES module loader.
    supported: { 'dynamic-import': false },
    // Modules that find files beside themselves (fonts, the demo folder, the batch worker) read import.meta.url.
    define: { 'import.meta.url': '__moduleUrl' },
    banner: { js: 'const __moduleUrl = require("node:url").pathToFileURL(__filename).href;' },
    sourcemap: true,
    outExtension: { '.js': '.cjs' },
    metafile: true,
    logLevel: 'warning',
  });
  const inputs = {};
  for (const path of Object.keys(result.metafile.inputs)) {
    if (path.includes('node_modules')) continue; // the bundled packages are covered by package-lock.json below

    const s = stamp(join(ROOT, path));
    if (s) inputs[relative(ROOT, join(ROOT, path))] = s;
  }
  // The build's own recipe and the packages it bundles count as inputs too.
  for (const path of ['scripts/cli-build.mjs', 'package.json', 'package-lock.json']) {
    const s = stamp(join(ROOT, path));
    if (s) inputs[path] = s;
  }
  mkdirSync(OUT, { recursive: true });
  const record = { entry: join(folder, 'main.cjs'), builtAt: new Date().toISOString(), inputs };
  const tmp = `${RECORD}.${process.pid}.tmp`;
  writeFileSync(tmp, `${JSON.stringify(record)}\n`);
  renameSync(tmp, RECORD);
  removeOldBuilds(folder);
  return join(OUT, record.entry);
}

/** The current build's entry file, building first when it is missing or stale. */
export async function currentCliBuild() {
  const record = readRecord();
  return isCurrent(record) ? join(OUT, record.entry) : await buildCli();
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const entry = await buildCli();
  console.log(`built ${relative(ROOT, entry)}`);
}
