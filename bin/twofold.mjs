#!/usr/bin/env node
// Entry point of the `twofold` command: runs the compiled command line (dist/cli/, CommonJS),
// built from the TypeScript sources on the first run and again whenever a source changed
// (scripts/cli-build.mjs).
import { currentCliBuild, requireBuilt } from '../scripts/cli-build.mjs';

const { main } = requireBuilt(await currentCliBuild());
process.exitCode = await main(process.argv.slice(2));
