/**
 * Every user action of the workbench, by id: its label, its keyboard shortcut and the menu
 * it sits in. Plain data, so Electron's main process builds its application menu from the
 * same list the renderer's toolbar and key handler use; what a command does lives in
 * `commands.ts`, once.
 */
export const COMMAND_CATALOG = [
  { id: 'case.demo', label: 'Load demo pair', menu: 'Case', keys: 'Ctrl+Shift+D' },
  { id: 'case.new', label: 'New case from files…', menu: 'Case', keys: 'Ctrl+N' },
  { id: 'case.save', label: 'Save case now', menu: 'Case', keys: 'Ctrl+S' },
  { id: 'go.intake', label: 'Intake', menu: 'Go', keys: 'Ctrl+1' },
  { id: 'go.breakpoints', label: 'Breakpoints', menu: 'Go', keys: 'Ctrl+2' },
  { id: 'go.dayover', label: 'Day 2 vs Day 1', menu: 'Go', keys: 'Ctrl+3' },
  { id: 'go.signoff', label: 'Sign-off', menu: 'Go', keys: 'Ctrl+4' },
  { id: 'go.recovery', label: 'Recovery calls', menu: 'Go', keys: 'Ctrl+5' },
  { id: 'review.day1', label: 'Review day 1', menu: 'Review', keys: 'Alt+1' },
  { id: 'review.day2', label: 'Review day 2', menu: 'Review', keys: 'Alt+2' },
  { id: 'review.undo', label: 'Undo last threshold change', menu: 'Review', keys: 'Ctrl+Z' },
  { id: 'review.redo', label: 'Redo threshold change', menu: 'Review', keys: 'Ctrl+Shift+Z' },
  { id: 'report.export', label: 'Export signed report', menu: 'Report', keys: 'Ctrl+E' },
  { id: 'report.verify', label: 'Verify a report…', menu: 'Report', keys: 'Ctrl+Shift+V' },
] as const;

export type CommandId = (typeof COMMAND_CATALOG)[number]['id'];

export const COMMAND_IDS: readonly string[] = COMMAND_CATALOG.map((c) => c.id);

/** `Ctrl+Shift+D` for a keyboard event, in the catalogue's spelling (Meta counts as Ctrl). */
export function keysOf(event: { key: string; ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }): string {
  const parts: string[] = [];
  if (event.ctrlKey || event.metaKey) parts.push('Ctrl');
  if (event.altKey) parts.push('Alt');
  if (event.shiftKey) parts.push('Shift');
  const key = event.key.length === 1 ? event.key.toUpperCase() : event.key;
  parts.push(key === '!' ? '1' : key === '@' ? '2' : key);
  return parts.join('+');
}

export function commandForKeys(keys: string): CommandId | null {
  return COMMAND_CATALOG.find((c) => c.keys === keys)?.id ?? null;
}
