/** Flag parsing shared by the commands: node's parseArgs, with mistakes as UsageError. */
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { UsageError } from './io';

export function parseFlags<T extends NonNullable<ParseArgsConfig['options']>>(args: string[], options: T, allowPositionals = true) {
  try {
    return parseArgs({ args, options, allowPositionals, strict: true });
  } catch (error) {
    throw new UsageError(error instanceof Error ? error.message : String(error));
  }
}

/** A numeric flag value, or a UsageError naming the flag. */
export function numberFlag(name: string, raw: string | undefined): number | undefined {
  if (raw === undefined) return undefined;
  const value = Number(raw);
  if (!Number.isFinite(value)) throw new UsageError(`--${name} expects a number, got '${raw}'`);
  return value;
}
