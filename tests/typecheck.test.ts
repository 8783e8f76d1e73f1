// The whole project type-checks under `strict` (tsconfig.json): a failing type is a failing test.
import { execFileSync } from 'node:child_process';
import { test, expect } from 'vitest';

test('tsc --noEmit finds no type errors', () => {
  let output = '';
  try {
    execFileSync('npx', ['tsc', '--noEmit', '-p', 'tsconfig.json'], { encoding: 'utf8', stdio: 'pipe' });
  } catch (error) {
    output = String((error as { stdout?: string }).stdout ?? error);
  }
  expect(output).toBe('');
}, 180_000);
