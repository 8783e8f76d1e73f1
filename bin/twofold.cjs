#!/usr/bin/env node
'use strict';
// Entry point of the `twofold` command: runs the compiled command line (dist/cli/), built from
// the TypeScript sources on the first run and again whenever a source changed
// (scripts/cli-start.cjs, scripts/cli-build.mjs).
require('../scripts/cli-start.cjs').run(process.argv.slice(2));
