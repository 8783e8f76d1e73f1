import { runPairsB, figures } from './tests/validation/day2-pairs';
const t = Date.now();
const n = Number(process.argv[2]);
const first = Number(process.argv[3]);
const a = runPairsB('null', n, first);
const b = runPairsB('decline', n, first + 5000);
console.log(JSON.stringify({ null: figures(a.results), nullSkipped: a.skipped, decline: figures(b.results), declineSkipped: b.skipped }));
console.log('s', (Date.now() - t) / 1000);
