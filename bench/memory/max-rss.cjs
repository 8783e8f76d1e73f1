// Preloaded into a measured `twofold` process (node --require): when the process exits, its
// peak resident set size (getrusage ru_maxrss, the whole process: heap, buffers, code, every
// thread) is written, in bytes, to the file named by TWOFOLD_MAX_RSS_FILE. A large input runs
// in a child process (scripts/start-flags.cjs) that inherits this hook and exits first; the
// parent then adds its own peak to the child's, so the figure is never less than the two
// processes held together.
const { readFileSync, writeFileSync } = require('node:fs');
const out = process.env.TWOFOLD_MAX_RSS_FILE;
if (out) {
  process.on('exit', () => {
    let earlier = 0;
    try {
      earlier = Number(readFileSync(out, 'utf8')) || 0;
    } catch {
      earlier = 0;
    }
    writeFileSync(out, String(earlier + process.resourceUsage().maxRSS * 1024));
  });
}
