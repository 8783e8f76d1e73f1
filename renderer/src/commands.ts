/**
 * The command registry: what each named action does. The toolbar buttons, the keyboard
 * handler and Electron's application menu all call `runCommand(id, ctx)`, so an action's
 * behaviour lives here once. Labels and shortcuts are in `command-catalog.ts`.
 */
import { COMMAND_CATALOG, type CommandId } from './command-catalog';

export type Screen = 'intake' | 'breakpoints' | 'dayover' | 'signoff' | 'recovery';

/** What a command may do, provided by the app shell. */
export interface CommandContext {
  readonly hasCase: boolean;
  readonly canUndo: boolean;
  readonly canRedo: boolean;
  go(screen: Screen): void;
  reviewDay(day: 1 | 2): void;
  loadDemo(): Promise<void>;
  saveNow(): Promise<void>;
  undo(): Promise<void>;
  redo(): Promise<void>;
  exportReport(): Promise<void>;
  chooseReportToVerify(): void;
  chooseFiles(): void;
}

interface CommandBehaviour {
  readonly enabled: (ctx: CommandContext) => boolean;
  readonly run: (ctx: CommandContext) => void | Promise<void>;
}

const always = () => true;
const withCase = (ctx: CommandContext) => ctx.hasCase;

export const COMMANDS: Readonly<Record<CommandId, CommandBehaviour>> = {
  'case.demo': { enabled: always, run: (ctx) => ctx.loadDemo() },
  'case.new': { enabled: always, run: (ctx) => { ctx.go('intake'); ctx.chooseFiles(); } },
  'case.save': { enabled: withCase, run: (ctx) => ctx.saveNow() },
  'go.intake': { enabled: always, run: (ctx) => ctx.go('intake') },
  'go.breakpoints': { enabled: withCase, run: (ctx) => ctx.go('breakpoints') },
  'go.dayover': { enabled: withCase, run: (ctx) => ctx.go('dayover') },
  'go.signoff': { enabled: withCase, run: (ctx) => ctx.go('signoff') },
  'go.recovery': { enabled: withCase, run: (ctx) => ctx.go('recovery') },
  'review.day1': { enabled: withCase, run: (ctx) => { ctx.go('breakpoints'); ctx.reviewDay(1); } },
  'review.day2': { enabled: withCase, run: (ctx) => { ctx.go('breakpoints'); ctx.reviewDay(2); } },
  'review.undo': { enabled: (ctx) => ctx.canUndo, run: (ctx) => ctx.undo() },
  'review.redo': { enabled: (ctx) => ctx.canRedo, run: (ctx) => ctx.redo() },
  'report.export': { enabled: withCase, run: (ctx) => { ctx.go('signoff'); return ctx.exportReport(); } },
  'report.verify': { enabled: always, run: (ctx) => { ctx.go('signoff'); ctx.chooseReportToVerify(); } },
};

export function labelOf(id: CommandId): string {
  return COMMAND_CATALOG.find((c) => c.id === id)?.label ?? id;
}

export function keysLabel(id: CommandId): string {
  return COMMAND_CATALOG.find((c) => c.id === id)?.keys ?? '';
}

/** Runs a command when it is enabled; says whether it ran. */
export async function runCommand(id: CommandId, ctx: CommandContext): Promise<boolean> {
  const command = COMMANDS[id];
  if (!command.enabled(ctx)) return false;
  await command.run(ctx);
  return true;
}
