/**
 * The renderer's one way to the host. Under Electron the preload has put a narrow bridge on
 * `window.twofoldHost`; in browser mode the same calls go over the local HTTP bridge with
 * the per-run token the page received in its URL fragment. Screens only see `HostClient`.
 */
import type { HostClient, HostMethod, HostReply, HostRequest } from '../../host/workbench/api';

declare global {
  interface Window {
    twofoldHost?: HostClient;
  }
}

const TOKEN_KEY = 'twofold-token';

function tokenFromPage(): string | null {
  const match = /(?:^#|&)token=([0-9a-f]{32,128})/.exec(window.location.hash);
  if (match) {
    sessionStorage.setItem(TOKEN_KEY, match[1]);
    // The token stays out of the address bar, screenshots and history once read.
    history.replaceState(null, '', window.location.pathname + window.location.search);
    return match[1];
  }
  return sessionStorage.getItem(TOKEN_KEY);
}

function httpClient(token: string | null): HostClient {
  return {
    async call<M extends HostMethod>(method: M, request: HostRequest<M>): Promise<HostReply<M>> {
      if (!token) {
        return { ok: false, error: { code: 'no-token', file: 'address', line: null, column: null, message: 'This page was opened without its access key; start Twofold again with npm start and use the address it prints.' } };
      }
      let response: Response;
      try {
        response = await fetch(`./api/${method}`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-twofold-token': token }, body: JSON.stringify(request) });
      } catch {
        return { ok: false, error: { code: 'host-gone', file: 'host', line: null, column: null, message: 'The Twofold host is not answering; it may have been closed. Your last autosave is kept.' } };
      }
      if (!response.ok) {
        return { ok: false, error: { code: `http-${response.status}`, file: 'host', line: null, column: null, message: `The host refused the request (${response.status}: ${await response.text()}).` } };
      }
      return (await response.json()) as HostReply<M>;
    },
    onCommand: () => () => undefined,
  };
}

export function connectHost(): HostClient {
  return window.twofoldHost ?? httpClient(tokenFromPage());
}
