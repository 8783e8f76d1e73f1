/**
 * The preload: the only bridge between the sandboxed page and the main process. It exposes
 * one object, `window.twofoldHost`, with two functions, and checks everything that passes:
 * a call names a known host method and its request matches that method's schema before it
 * leaves the page; a menu command from the main process is passed on only when it is a
 * known command id. No Electron or Node object reaches the page.
 */
import { contextBridge, ipcRenderer, type IpcRendererEvent } from 'electron';
import { bridgeFailure, HOST_METHODS, isHostMethod, type HostClient } from '../host/workbench/api';
import { COMMAND_IDS } from '../renderer/src/command-catalog';
import { CHANNEL_COMMAND, CHANNEL_HOST } from './channels';

const host: HostClient = {
  async call(method, request) {
    if (!isHostMethod(method)) return bridgeFailure('unknown-method', `Twofold has no host action called '${String(method)}'.`);
    const checked = HOST_METHODS[method].request.safeParse(request);
    if (!checked.success) return bridgeFailure('bad-request', `The request to '${method}' was not valid: ${checked.error.issues[0]?.message ?? 'unknown problem'}.`);
    return ipcRenderer.invoke(CHANNEL_HOST, method, checked.data);
  },
  onCommand(listener) {
    const relay = (_event: IpcRendererEvent, id: unknown) => {
      if (typeof id === 'string' && COMMAND_IDS.includes(id)) listener(id);
    };
    ipcRenderer.on(CHANNEL_COMMAND, relay);
    return () => {
      ipcRenderer.removeListener(CHANNEL_COMMAND, relay);
    };
  },
};

contextBridge.exposeInMainWorld('twofoldHost', host);
