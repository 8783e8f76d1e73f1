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
// `.npmrc` sets ignore-scripts, so no install step can build it: bin/twofold.mjs calls
// `currentCliBuild()` at every start, which stats the files the last build was made from
// (recorded in dist/cli/build.json) and rebuilds only when one changed or the build is
// missing. Each build goes to a fresh folder and build.json is replaced by rename, so
// processes that start at the same moment never see half a build.
//
// `node scripts/cli-build.mjs` (npm run build:cli) builds it by hand.
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const OUT = join(ROOT, 'dist', 'cli');
const RECORD = join(OUT, 'build.json');
/** Older build folders are removed once they are this old (a running process may still load chunks from one). */
const KEEP_OLD_BUILDS_MS = 60 * 60 * 1000;

function stamp(path) {
  try {
    const s = statSync(path);
    return [s.mtimeMs, s.size];
  } catch {
    return null;
  }
}

function readRecord() {
  try {
    return JSON.parse(readFileSync(RECORD, 'utf8'));
  } catch {
    return null;
  }
}

/** True when the recorded build exists and every file it was made from is unchanged (time and size). */
function isCurrent(record) {
  if (!record || typeof record.entry !== 'string' || !record.inputs) return false;
  if (!existsSync(join(OUT, record.entry))) return false;
  for (const [path, before] of Object.entries(record.inputs)) {
    const now = stamp(join(ROOT, path));
    if (!now || now[0] !== before[0] || now[1] !== before[1]) return false;
  }
  return true;
}

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

/**
 * V8 code cache (Node 20 has no module.enableCompileCache): every CommonJS file a command
 * loads, the build's own and the packages', is compiled with the cached data V8 wrote after
 * an earlier run, so its functions are not parsed and compiled again. The cache is named by
 * the file's content hash and lives in the build's folder (a rebuild starts without one); data
 * V8 rejects (another Node version or flags) is written anew, and a cache that cannot be
 * written or read only costs compile time.
 */
export function requireBuilt(entry) {
  const require = createRequire(import.meta.url);
  const Module = require('node:module');
  const vm = require('node:vm');
  const { createHash } = require('node:crypto');
  const cacheDir = join(dirname(entry), 'code-cache');
  const fresh = [];
  const compile = Module.prototype._compile;
  Module.prototype._compile = function (content, filename) {
    if (!filename.startsWith(ROOT)) return compile.call(this, content, filename);
    const hash = createHash('sha256').update(content).digest('hex').slice(0, 32);
    const cacheFile = join(cacheDir, `${hash}.v8`);
    let cachedData;
    try {
      cachedData = readFileSync(cacheFile);
    } catch {
      cachedData = undefined;
    }
    const script = new vm.Script(Module.wrap(content), { filename, cachedData, importModuleDynamically: vm.constants.USE_MAIN_CONTEXT_DEFAULT_LOADER });
    if (!cachedData || script.cachedDataRejected) fresh.push([cacheFile, script]);
    const mod = this;
    const requireHere = (id) => mod.require(id);
    requireHere.resolve = (request, options) => Module._resolveFilename(request, mod, false, options);
    requireHere.main = process.mainModule;
    requireHere.cache = Module._cache;
    return script.runInThisContext({ displayErrors: true }).call(mod.exports, mod.exports, requireHere, mod, filename, dirname(filename));
  };
  process.once('exit', () => {
    if (fresh.length === 0) return;
    try {
      mkdirSync(cacheDir, { recursive: true });
      for (const [file, script] of fresh) {
        const tmp = `${file}.${process.pid}.tmp`;
        writeFileSync(tmp, script.createCachedData());
        renameSync(tmp, file);
      }
    } catch {
      // Not written: the next start compiles again.
    }
  });
  return require(entry);
}
