/**
 * The browser mode's local bridge refuses what it must refuse. References: the loopback
 * address 127.0.0.1 (RFC 1122 §3.2.1.3), the Host-header check against DNS rebinding and the
 * Origin check (common practice for local servers), and the page's own Content-Security-
 * Policy in renderer/index.html, which must say the same as the header.
 */
import { mkdtempSync, readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBridge, type RunningBridge } from '../../../host/workbench/http-bridge';
import { createWiredService } from '../../../host/workbench/wiring';
import { CONTENT_SECURITY_POLICY } from '../../../host/workbench/csp';

const TOKEN = 'a'.repeat(64);
let bridge: RunningBridge;
let dist: string;

interface Reply {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

function call(path: string, options: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port: bridge.port, path, method: options.method ?? 'GET', headers: options.headers }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (chunk: string) => (body += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
    });
    req.on('error', reject);
    req.end(options.body);
  });
}

const api = (method: string, body: unknown, headers: Record<string, string> = { 'x-twofold-token': TOKEN }) =>
  call(`/api/${method}`, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body: JSON.stringify(body) });

beforeAll(async () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'twofold-bridge-'));
  dist = join(dataDir, 'dist');
  mkdirSync(dist);
  writeFileSync(join(dist, 'index.html'), '<!doctype html><title>t</title>');
  writeFileSync(join(dataDir, 'secret.txt'), 'not for the page');
  bridge = await startBridge({ service: createWiredService({ dataDir }), distDir: dist, token: TOKEN });
});

afterAll(async () => {
  await bridge?.close();
});

describe('local HTTP bridge', () => {
  it('listens on the loopback address only', () => {
    expect((bridge.server.address() as AddressInfo).address).toBe('127.0.0.1');
    expect(bridge.url).toBe(`http://127.0.0.1:${bridge.port}/#token=${TOKEN}`);
  });

  it('answers the API with the token, and refuses it without or with a wrong one', async () => {
    const good = await api('listCases', {});
    expect(good.status).toBe(200);
    expect(JSON.parse(good.body)).toEqual({ ok: true, value: { cases: [] } });
    expect((await api('listCases', {}, {})).status).toBe(403);
    expect((await api('listCases', {}, { 'x-twofold-token': 'b'.repeat(64) })).status).toBe(403);
    expect((await api('listCases', {}, { 'x-twofold-token': TOKEN.slice(1) })).status).toBe(403);
  });

  it('refuses a foreign Host header (DNS rebinding) and a cross-origin Origin', async () => {
    expect((await call('/index.html', { headers: { host: `localhost:${bridge.port}` } })).status).toBe(421);
    expect((await call('/index.html', { headers: { host: `evil.example:${bridge.port}` } })).status).toBe(421);
    expect((await api('listCases', {}, { 'x-twofold-token': TOKEN, origin: 'http://evil.example' })).status).toBe(403);
    expect((await api('listCases', {}, { 'x-twofold-token': TOKEN, origin: `http://127.0.0.1:${bridge.port}` })).status).toBe(200);
  });

  it('accepts only POST with JSON on the API', async () => {
    expect((await call('/api/listCases', { headers: { 'x-twofold-token': TOKEN } })).status).toBe(405);
    expect((await call('/api/listCases', { method: 'POST', headers: { 'x-twofold-token': TOKEN, 'content-type': 'text/plain' }, body: '{}' })).status).toBe(415);
    expect((await call('/api/listCases', { method: 'POST', headers: { 'x-twofold-token': TOKEN, 'content-type': 'application/json' }, body: '{not json' })).status).toBe(400);
  });

  it('validates every request against its schema and names the field', async () => {
    const unknown = JSON.parse((await api('deleteEverything', {})).body);
    expect(unknown).toMatchObject({ ok: false, error: { code: 'unknown-method' } });
    const badId = JSON.parse((await api('openCase', { caseId: '../../etc' })).body);
    expect(badId).toMatchObject({ ok: false, error: { code: 'bad-request' } });
    expect(badId.error.message).toContain('caseId');
    const pathName = JSON.parse((await api('createCase', { title: 't', day1: { name: '../x.csv', base64: '' }, day2: { name: 'y.csv', base64: '' }, clinical: {} })).body);
    expect(pathName).toMatchObject({ ok: false, error: { code: 'bad-request' } });
  });

  it('serves the page with the strict CSP, and nothing outside its folder', async () => {
    const page = await call('/');
    expect(page.status).toBe(200);
    expect(page.headers['content-security-policy']).toBe(CONTENT_SECURITY_POLICY);
    expect(page.headers['x-content-type-options']).toBe('nosniff');
    for (const path of ['/%2e%2e/secret.txt', '/..%2fsecret.txt', '/../secret.txt']) {
      const escape = await call(path);
      expect([403, 404]).toContain(escape.status);
      expect(escape.body).not.toContain('not for the page');
    }
  });

  it('the page carries the same policy in its meta tag (frame-ancestors is header-only by the CSP spec)', () => {
    const html = readFileSync(fileURLToPath(new URL('../../../renderer/index.html', import.meta.url)), 'utf8');
    const meta = /http-equiv="Content-Security-Policy" content="([^"]+)"/.exec(html)?.[1];
    const headerWithoutFrameAncestors = CONTENT_SECURITY_POLICY.split('; ').filter((d) => !d.startsWith('frame-ancestors')).join('; ');
    expect(meta).toBe(headerWithoutFrameAncestors);
    expect(CONTENT_SECURITY_POLICY).toContain("script-src 'self'");
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/https?:|unsafe-eval/);
  });
});
