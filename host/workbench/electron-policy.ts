/**
 * The Electron main process's decisions, as plain functions so they are tested in Node
 * without the Electron runtime: which URLs the page may load, where an app URL maps on disk,
 * and the application menu built from the command catalogue.
 */
import { normalize, join, sep } from 'node:path';

export const APP_ORIGIN = 'twofold://app';

/** The page is ours when it comes from the app origin; anything else is refused. */
export function isAppUrl(url: string): boolean {
  return url === APP_ORIGIN || url.startsWith(`${APP_ORIGIN}/`);
}

/**
 * Requests the window may make: the app's own files, and the in-memory URLs the page itself
 * creates (blob:, data:) for the worker, the charts and the report preview. No network.
 */
export function isAllowedRequest(url: string): boolean {
  if (isAppUrl(url)) return true;
  if (url.startsWith(`blob:${APP_ORIGIN}/`)) return true;
  if (url.startsWith('data:')) return true;
  return url.startsWith('devtools://');
}

/** The file under `distDir` an app URL names, or null when the path leaves it. */
export function appFilePath(distDir: string, url: string): string | null {
  if (!isAppUrl(url)) return null;
  const pathname = decodeURIComponent(new URL(url).pathname);
  const root = normalize(distDir);
  const path = normalize(join(root, pathname === '/' || pathname === '' ? 'index.html' : pathname));
  return path.startsWith(root + sep) ? path : null;
}

/** `Ctrl+Shift+D` from the catalogue as an Electron accelerator (Cmd on macOS). */
export function acceleratorOf(keys: string): string {
  return keys.replace(/^Ctrl\b/, 'CmdOrCtrl');
}

export interface MenuItemSpec {
  readonly id: string;
  readonly label: string;
  readonly accelerator: string;
}

export interface MenuSpec {
  readonly label: string;
  readonly items: readonly MenuItemSpec[];
}

/** Menus in catalogue order, each with its commands in catalogue order. */
export function menuSpec(catalog: readonly { id: string; label: string; menu: string; keys: string }[]): MenuSpec[] {
  const menus: { label: string; items: MenuItemSpec[] }[] = [];
  for (const c of catalog) {
    let menu = menus.find((m) => m.label === c.menu);
    if (!menu) {
      menu = { label: c.menu, items: [] };
      menus.push(menu);
    }
    menu.items.push({ id: c.id, label: c.label, accelerator: acceleratorOf(c.keys) });
  }
  return menus;
}
