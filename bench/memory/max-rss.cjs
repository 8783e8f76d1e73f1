// Preloaded into a measured `twofold` process (node --require): when the process exits, its
// peak resident set size (getrusage ru_maxrss, the whole process: heap, buffers, code, every
// thread) is written, in bytes, to the file named by TWOFOLD_MAX_RSS_FILE.
const { writeFileSync } = require('node:fs');
const out = process.env.TWOFOLD_MAX_RSS_FILE;
if (out) process.on('exit', () => writeFileSync(out, String(process.resourceUsage().maxRSS * 1024)));
