/**
 * The Electron main process: one window on the app's own protocol, the application menu
 * from the command catalogue, and the host service (case folders, atomic saves, report
 * export and signing, verification) answering the preload over IPC.
 *
 * Security, following Electron's own guide: context isolation, the sandbox, no Node in the
 * page, a strict Content-Security-Policy on every response, navigation and new windows
 * refused, every permission request denied, every request outside the app origin cancelled,
 * and every IPC message checked (sender origin, method, zod schema) before it is served.
 */
import { app, BrowserWindow, ipcMain, Menu, net, protocol, session, type MenuItemConstructorOptions } from 'electron';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dispatch } from '../host/workbench/api';
import { CONTENT_SECURITY_POLICY } from '../host/workbench/csp';
import { createWiredService } from '../host/workbench/wiring';
import { appFilePath, isAllowedRequest, isAppUrl, menuSpec } from '../host/workbench/electron-policy';
import { COMMAND_CATALOG } from '../renderer/src/command-catalog';
import { DEFERRED_AFTER_INPUT_FEATURE } from '../host/workbench/response-flags';
import { APP_ORIGIN, APP_SCHEME, CHANNEL_COMMAND, CHANNEL_HOST } from './channels';

/** electron/dist/main.mjs → the repository root two folders up. */
const HERE = dirname(fileURLToPath(import.meta.url));
const ROOT = join(HERE, '..', '..');
const DIST = join(ROOT, 'renderer', 'dist');

protocol.registerSchemesAsPrivileged([{ scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true } }]);

function serveApp(): void {
  protocol.handle(APP_SCHEME, async (request) => {
    const path = appFilePath(DIST, request.url);
    if (!path) return new Response('not found', { status: 404 });
    const response = await net.fetch(pathToFileURL(path).toString());
    const headers = new Headers(response.headers);
    headers.set('Content-Security-Policy', CONTENT_SECURITY_POLICY);
    headers.set('X-Content-Type-Options', 'nosniff');
    return new Response(response.body, { status: response.status, headers });
  });
}

function lockDownSession(): void {
  const s = session.defaultSession;
  s.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
  s.setPermissionCheckHandler(() => false);
  s.webRequest.onBeforeRequest((details, callback) => callback({ cancel: !isAllowedRequest(details.url) }));
}

function buildMenu(win: BrowserWindow): void {
  const send = (id: string) => win.webContents.send(CHANNEL_COMMAND, id);
  const template: MenuItemConstructorOptions[] = menuSpec(COMMAND_CATALOG).map((menu) => ({
    label: menu.label,
    // The page's own key handler runs the shortcut; the menu only shows it, so no action runs twice.
    submenu: menu.items.map((item) => ({ label: item.label, accelerator: item.accelerator, registerAccelerator: false, click: () => send(item.id) })),
  }));
  template.push({ label: 'Window', submenu: [{ role: 'reload' }, { role: 'togglefullscreen' }, { role: 'quit' }] });
  Menu.setApplicationMenu(Menu.buildFromTemplate(template));
}

function createWindow(): BrowserWindow {
  const win = new BrowserWindow({
    width: 1440,
    height: 960,
    title: 'Twofold',
    show: false,
    webPreferences: {
      preload: join(HERE, 'preload.cjs'),
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      webviewTag: false,
      navigateOnDragDrop: false,
      spellcheck: false,
      // Chromium's built-in PDF viewer, for the report preview (a blob: URL the page made); no other plugin exists here.
      plugins: true,
    },
  });
  win.once('ready-to-show', () => win.show());
  buildMenu(win);
  void win.loadURL(`${APP_ORIGIN}/index.html`);
  return win;
}

app.on('web-contents-created', (_event, contents) => {
  // The workbench is one page; it never navigates, so every navigation is refused.
  contents.on('will-navigate', (event) => event.preventDefault());
  contents.on('will-redirect', (event) => event.preventDefault());
  contents.on('will-attach-webview', (event) => event.preventDefault());
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
});

// Before the app is ready, as Chromium reads its features at start-up (response-flags.ts).
app.commandLine.appendSwitch('disable-features', DEFERRED_AFTER_INPUT_FEATURE);

app.whenReady().then(() => {
  const service = createWiredService({ dataDir: app.getPath('userData') });
  ipcMain.handle(CHANNEL_HOST, async (event, method: unknown, request: unknown) => {
    const origin = event.senderFrame?.url ?? '';
    if (!isAppUrl(origin)) return { ok: false, error: { code: 'bad-sender', file: 'bridge', line: null, column: null, message: 'A request came from outside the Twofold page and was refused.' } };
    return dispatch(service, typeof method === 'string' ? method : '', request);
  });
  serveApp();
  lockDownSession();
  createWindow();
});

app.on('window-all-closed', () => app.quit());
