#!/usr/bin/env node
// The `twofold` command under its earlier path; bin/twofold.cjs is the command (package.json
// "bin"), which Node starts without its ES module loader.
import { createRequire } from 'node:module';

createRequire(import.meta.url)('./twofold.cjs');
