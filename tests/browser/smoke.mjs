// Browser smoke test of the Apportion page, served over http and as the single file from
// file://, in Debian's chromium (headless, SwiftShader WebGL2) driven by playwright-core.
// The page reports its first frame on the console ("apportion:first-frame {...}"); the test
// compares the fair shares shown with the command line's for the same demo network, and
// keeps a screenshot of each page in the artefacts folder.
//
// usage: node smoke.mjs --web DIR --expect-shares FILE.json --artefacts DIR
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import os from 'node:os';
import { chromium } from 'playwright-core';

const arg = (name) => { const i = process.argv.indexOf(name); return i > 0 ? process.argv[i + 1] : undefined; };
const webDir = path.resolve(arg('--web'));
const expected = JSON.parse(fs.readFileSync(arg('--expect-shares'), 'utf8')).demands.map((d) => d.share);
const artefacts = path.resolve(arg('--artefacts'));
fs.mkdirSync(artefacts, { recursive: true });

const types = { '.html': 'text/html', '.js': 'text/javascript', '.wasm': 'application/wasm' };
const server = http.createServer((req, res) => {
  const file = path.join(webDir, path.normalize(decodeURIComponent(req.url.split('?')[0])).replace(/^\/+/, ''));
  if (!file.startsWith(webDir) || !fs.existsSync(file) || fs.statSync(file).isDirectory()) {
    res.writeHead(404); res.end(); return;
  }
  res.writeHead(200, { 'Content-Type': types[path.extname(file)] || 'application/octet-stream' });
  fs.createReadStream(file).pipe(res);
});
await new Promise((ok) => server.listen(0, '127.0.0.1', ok));
const base = `http://127.0.0.1:${server.address().port}`;

const flags = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync', '--enable-unsafe-swiftshader'];
let passed = 0, failed = 0;
const check = (name, ok, detail = '') => {
  if (ok) { passed++; console.log(`ok    ${name}`); } else { failed++; console.log(`FAIL  ${name} ${detail}`); }
};

async function open(name, url) {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'apportion-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium', headless: true, args: flags, deviceScaleFactor: 2,
    viewport: { width: 1100, height: 700 } });
  try {
    const page = context.pages()[0] || await context.newPage();
    const requests = [];
    page.on('request', (r) => requests.push(r.url()));
    const started = Date.now();
    const first = new Promise((resolve) => page.on('console', (m) => {
      if (m.text().startsWith('apportion:first-frame ')) resolve(JSON.parse(m.text().slice(22)));
    }));
    await page.goto(url);
    const state = await Promise.race([first, new Promise((r) => setTimeout(() => r(null), 30000))]);
    check(`${name}: first frame drawn`, state !== null);
    if (state) {
      console.log(`      ${name}: first frame after ${Date.now() - started} ms`);
      check(`${name}: demo network loaded`, state.network.length > 0, JSON.stringify(state));
      check(`${name}: fair shares solved`, state.status === 'optimal', state.status);
      const close = state.shares.length === expected.length &&
        state.shares.every((x, i) => Math.abs(x - expected[i]) <= 1e-6 * Math.max(1, Math.abs(expected[i])));
      check(`${name}: shares [${state.shares}] equal the command line's [${expected}]`, close);
      check(`${name}: sharp on HiDPI (device pixel ratio ${state.dpr} used)`, state.dpr === 2);
    }
    await page.waitForTimeout(300);
    await page.screenshot({ path: path.join(artefacts, `${name}.png`) });
    const foreign = requests.filter((u) => !u.startsWith(base) && !u.startsWith('file://') && !u.startsWith('data:'));
    check(`${name}: no request leaves the machine`, foreign.length === 0, foreign.join(' '));
  } finally {
    await context.close();
    fs.rmSync(profile, { recursive: true, force: true });
  }
}

try {
  await open('served', `${base}/apportion.html`);
  await open('single-file', 'file://' + path.join(webDir, 'apportion-single.html'));
} finally {
  server.close();
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed ? 1 : 0);
