// A small real-browser test harness: serves the built app with `vite preview`, drives Debian's Chromium
// through playwright-core, and fails a test on any console error, page error or request off this machine.
import { spawn } from 'node:child_process';
import { createServer } from 'node:net';
import { mkdirSync } from 'node:fs';
import { chromium } from 'playwright-core';
import { CHROMIUM_ARGS, ensureChromium } from './chromium.mjs';

export const ARTIFACTS = 'test-results/e2e';

function freePort() {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.listen(0, '127.0.0.1', () => { const { port } = srv.address(); srv.close(() => resolve(port)); });
    srv.on('error', reject);
  });
}

async function waitFor(url, ms) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    try { const r = await fetch(url); if (r.ok) return; } catch { /* not up yet */ }
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`server at ${url} did not answer within ${ms} ms`);
}

/** Start the preview server and the browser; returns helpers and a stop function. */
export async function startHarness() {
  const executablePath = ensureChromium();
  mkdirSync(ARTIFACTS, { recursive: true });
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}/`;
  const server = spawn(process.execPath, ['node_modules/vite/bin/vite.js', 'preview', '--host', '127.0.0.1', '--port', String(port), '--strictPort'], { stdio: ['ignore', 'pipe', 'pipe'] });
  let serverLog = '';
  server.stdout.on('data', (d) => { serverLog += d; });
  server.stderr.on('data', (d) => { serverLog += d; });
  try {
    await waitFor(baseUrl, 20000);
  } catch (e) {
    server.kill();
    throw new Error(`${e.message}\n${serverLog}`, { cause: e });
  }
  const browser = await chromium.launch({ executablePath, headless: true, args: CHROMIUM_ARGS });
  return {
    baseUrl,
    browser,
    /** A fresh page that records console errors, page errors and requests to other hosts. */
    async newPage(options = {}) {
      const context = await browser.newContext({ viewport: { width: 1366, height: 768 }, ...options });
      const page = await context.newPage();
      const problems = [];
      page.on('console', (msg) => { if (msg.type() === 'error') problems.push(`console error: ${msg.text()}`); });
      page.on('pageerror', (err) => problems.push(`page error: ${err.message}`));
      page.on('request', (req) => {
        const url = new URL(req.url());
        if (!['127.0.0.1', 'localhost'].includes(url.hostname) && !['data:', 'blob:', 'about:'].includes(url.protocol)) problems.push(`request off this machine: ${req.url()}`);
      });
      return { page, context, problems };
    },
    async stop() {
      await browser.close().catch(() => {});
      server.kill();
    },
  };
}
