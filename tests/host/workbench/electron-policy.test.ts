/**
 * The main process's decisions and the command registry, checked in Node. References:
 * Electron's security guide (load only your own content, refuse navigation and new windows;
 * common practice stated there), Electron's accelerator syntax (`CmdOrCtrl`), and the
 * registry's own rule that every action is one named command.
 */
import { describe, expect, it } from 'vitest';
import { acceleratorOf, appFilePath, isAllowedRequest, isAppUrl, menuSpec } from '../../../host/workbench/electron-policy';
import { COMMAND_CATALOG, commandForKeys, keysOf } from '../../../renderer/src/command-catalog';
import { COMMANDS } from '../../../renderer/src/commands';

describe('what the window may load', () => {
  it('allows the app origin and the page’s own in-memory URLs only', () => {
    expect(isAllowedRequest('twofold://app/index.html')).toBe(true);
    expect(isAllowedRequest('twofold://app/assets/index.js')).toBe(true);
    expect(isAllowedRequest('blob:twofold://app/3f1c')).toBe(true);
    expect(isAllowedRequest('data:image/png;base64,AAAA')).toBe(true);
    for (const url of ['https://example.org/font.woff2', 'http://127.0.0.1:8080/', 'file:///etc/passwd', 'twofold://other/x', 'ws://localhost:1/']) {
      expect(isAllowedRequest(url)).toBe(false);
    }
    expect(isAppUrl('twofold://appx/index.html')).toBe(false);
  });

  it('maps app URLs into the build folder and refuses escapes', () => {
    expect(appFilePath('/opt/tf/dist', 'twofold://app/')).toBe('/opt/tf/dist/index.html');
    expect(appFilePath('/opt/tf/dist', 'twofold://app/assets/a.js')).toBe('/opt/tf/dist/assets/a.js');
    expect(appFilePath('/opt/tf/dist', 'twofold://app/..%2f..%2fetc%2fpasswd')).toBeNull();
    expect(appFilePath('/opt/tf/dist', 'https://example.org/a.js')).toBeNull();
  });
});

describe('commands, menu and shortcuts', () => {
  it('every catalogued command has one behaviour, and every behaviour is catalogued', () => {
    expect(Object.keys(COMMANDS).sort()).toEqual(COMMAND_CATALOG.map((c) => c.id).sort());
  });

  it('no two commands share a shortcut', () => {
    const keys = COMMAND_CATALOG.map((c) => c.keys);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('a key press finds its command: Ctrl+Z is undo, Ctrl+Shift+Z redo, Meta counts as Ctrl', () => {
    expect(commandForKeys(keysOf({ key: 'z', ctrlKey: true, metaKey: false, shiftKey: false, altKey: false }))).toBe('review.undo');
    expect(commandForKeys(keysOf({ key: 'Z', ctrlKey: true, metaKey: false, shiftKey: true, altKey: false }))).toBe('review.redo');
    expect(commandForKeys(keysOf({ key: 'e', ctrlKey: false, metaKey: true, shiftKey: false, altKey: false }))).toBe('report.export');
    expect(commandForKeys(keysOf({ key: 'z', ctrlKey: false, metaKey: false, shiftKey: false, altKey: false }))).toBeNull();
  });

  it('the application menu holds every command once, with Electron accelerators', () => {
    const menus = menuSpec(COMMAND_CATALOG);
    expect(menus.map((m) => m.label)).toEqual(['Case', 'Go', 'Review', 'Report']);
    const ids = menus.flatMap((m) => m.items.map((i) => i.id));
    expect(ids).toEqual(COMMAND_CATALOG.map((c) => c.id));
    expect(acceleratorOf('Ctrl+Shift+D')).toBe('CmdOrCtrl+Shift+D');
    expect(acceleratorOf('Alt+1')).toBe('Alt+1');
  });
});
