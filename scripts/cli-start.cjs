'use strict';
// What the `twofold` command does at every start (bin/twofold.cjs): find the current build of
// the command line (dist/cli/, scripts/cli-build.mjs) by one read of build.json and a stat of
// each file it was made from, build it only when one changed or it is missing, and run it
// with V8's code cache. CommonJS, like the build, so that Node starts the command without its
// ES module loader; the build script (and esbuild) load only when a build is needed.
const { existsSync, mkdirSync, readFileSync, renameSync, statSync, writeFileSync } = require('node:fs');
const { dirname, join, relative, resolve } = require('node:path');

const ROOT = resolve(__dirname, '..');
const OUT = join(ROOT, 'dist', 'cli');
const RECORD = join(OUT, 'build.json');

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

/**
 * V8 code cache (Node 20 has no module.enableCompileCache): every CommonJS file a command
 * loads, the build's own and the packages', is compiled with the cached data V8 wrote after
 * an earlier run, so its functions are not parsed and compiled again. The cache is named by
 * the file's path, size and modification time (not a content hash: loading node:crypto alone
 * costs a start about 10 ms) and lives in the build's folder (a rebuild starts without one); data
 * V8 rejects (another Node version or flags) is written anew, and a cache that cannot be
 * written or read only costs compile time.
 */
function requireBuilt(entry) {
  const Module = require('node:module');
  const vm = require('node:vm');
  const cacheDir = join(dirname(entry), 'code-cache');
  const fresh = [];
  const compile = Module.prototype._compile;
  Module.prototype._compile = function (content, filename) {
    if (!filename.startsWith(ROOT)) return compile.call(this, content, filename);
    const s = stamp(filename);
    const cacheFile = join(cacheDir, `${relative(ROOT, filename).replace(/[^\w.-]+/g, '_')}-${s ? `${s[1]}-${Math.round(s[0])}` : content.length}.v8`);
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

/** Runs the command line with `argv`; the exit code goes to process.exitCode. */
async function run(argv) {
  const startFlags = require('./start-flags.cjs');
  const flags = startFlags.childFlags(argv);
  if (flags) {
    const code = await startFlags.runInChild(argv, flags);
    if (code !== null) {
      process.exitCode = code;
      return;
    }
    process.stderr.write('twofold: this input needed more memory than the limit set for large files; running it again without the limit.\n');
  }
  const record = readRecord();
  let entry;
  if (isCurrent(record)) entry = join(OUT, record.entry);
  else {
    const { pathToFileURL } = require('node:url');
    entry = await (await import(pathToFileURL(join(__dirname, 'cli-build.mjs')).href)).buildCli();
  }
  process.exitCode = await requireBuilt(entry).main(argv);
}

module.exports = { ROOT, OUT, RECORD, stamp, readRecord, isCurrent, run };
