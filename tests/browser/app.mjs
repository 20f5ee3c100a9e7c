// Browser tests of the Apportion page in Debian's chromium (headless, SwiftShader WebGL2),
// driven by playwright-core. The page reports events on the console as
// "apportion:<event> {json}" and runs a button's action through the exported
// apportion_test_action(), so no test guesses pixels. Screenshots go to the artefacts folder.
//
// usage: node app.mjs --web DIR --root REPO --expected DIR --artefacts DIR
//   DIR of --expected holds the command line's results: <demo>.fair.json for each demo.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import os from 'node:os';
import { chromium } from 'playwright-core';

const arg = (name) => { const i = process.argv.indexOf(name); return i > 0 ? process.argv[i + 1] : undefined; };
const webDir = path.resolve(arg('--web'));
const root = path.resolve(arg('--root'));
const expectedDir = path.resolve(arg('--expected'));
const artefacts = path.resolve(arg('--artefacts'));
fs.mkdirSync(artefacts, { recursive: true });
const expected = (demo) => JSON.parse(fs.readFileSync(path.join(expectedDir, `${demo}.fair.json`), 'utf8'));
const demoFile = (demo) => path.join(root, 'demo-networks', `${demo}.json`);

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
const sameShares = (a, b) => a.length === b.length &&
  a.every((x, i) => Math.abs(x - b[i]) <= 1e-6 * Math.max(1, Math.abs(b[i])));

// A browser with a fresh profile; events() waits for the next console event of a kind.
async function browser() {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'apportion-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium', headless: true, args: flags, deviceScaleFactor: 2,
    acceptDownloads: true, viewport: { width: 1200, height: 760 } });
  const page = context.pages()[0] || await context.newPage();
  const requests = [];
  page.on('request', (r) => requests.push(r.url()));
  const seen = [];
  const waiters = [];
  page.on('console', (m) => {
    const t = m.text();
    const match = /^apportion:([a-z-]+) (.*)$/.exec(t);
    if (!match) return;
    let data = match[2];
    try { data = JSON.parse(match[2]); } catch (e) { /* a plain text event, e.g. share-link */ }
    const ev = { kind: match[1], data };
    seen.push(ev);
    for (const w of waiters.splice(0)) if (!w(ev)) waiters.push(w);
  });
  const next = (kind, timeout = 30000) => new Promise((resolve) => {
    const timer = setTimeout(() => resolve(null), timeout);
    waiters.push((ev) => { if (ev.kind !== kind) return false; clearTimeout(timer); resolve(ev.data); return true; });
  });
  const act = (what) => page.evaluate((w) => {
    const len = Module.lengthBytesUTF8(w) + 1, ptr = Module._malloc(len);
    Module.stringToUTF8(w, ptr, len);
    Module._apportion_test_action(ptr);
    Module._free(ptr);
  }, what);
  const close = async () => { await context.close(); fs.rmSync(profile, { recursive: true, force: true }); };
  return { page, requests, next, act, close, seen };
}

const harrowmere = expected('harrowmere-fibre').demands.map((d) => d.share);
const lowmoor = expected('lowmoor-relief-roads');
let shareLink = null;

try {
  // 1. Served page: first frame, the demo's shares equal the command line's.
  {
    const b = await browser();
    const first = b.next('first-frame');
    const started = Date.now();
    await b.page.goto(`${base}/apportion.html`);
    const s = await first;
    check('served: first frame drawn', s !== null);
    if (s) {
      console.log(`      served: first frame after ${Date.now() - started} ms`);
      check('served: demo shares equal the command line\'s', s.status === 'optimal' && sameShares(s.shares, harrowmere),
            JSON.stringify(s.shares));
      check('served: sharp on HiDPI (device pixel ratio 2 used)', s.dpr === 2);
    }
    await b.page.screenshot({ path: path.join(artefacts, 'served.png') });

    // 2. Export the shares as CSV and compare with the command line's result.
    const dl = b.page.waitForEvent('download');
    await b.act('export-demands-csv');
    const download = await dl;
    const csv = fs.readFileSync(await download.path(), 'utf8').trim().split(/\r?\n/);
    const col = csv[0].split(',').indexOf('share');
    const csvShares = csv.slice(1).map((line) => Number(line.split(',')[col]));
    check(`CSV export: ${download.suggestedFilename()} holds the command line's shares`, sameShares(csvShares, harrowmere),
          JSON.stringify(csvShares));

    // 2b. The picture as SVG (with legend and caution) and as PNG.
    const svgDl = b.page.waitForEvent('download');
    await b.act('export-svg');
    const svg = fs.readFileSync(await (await svgDl).path(), 'utf8');
    check('SVG export: a picture with a legend and the caution', svg.startsWith('<svg') &&
          svg.includes('arc utilisation') && svg.includes('planning aid'));
    const pngDl = b.page.waitForEvent('download');
    await b.act('export-png');
    const png = fs.readFileSync(await (await pngDl).path());
    check('PNG export: a PNG image of the canvas', png.length > 1000 &&
          png.subarray(1, 4).toString() === 'PNG', `${png.length} bytes`);
    fs.writeFileSync(path.join(artefacts, 'exported.png'), png);
    fs.writeFileSync(path.join(artefacts, 'exported.svg'), svg);

    // 3. Open another network through the file picker.
    const chooser = b.page.waitForEvent('filechooser');
    await b.act('open');
    const opened = b.next('opened');
    await (await chooser).setFiles(demoFile('lowmoor-relief-roads'));
    const o = await opened;
    check('open: the relief network replaces the demo', o && o.network === lowmoor.network, JSON.stringify(o));
    check('open: its shares equal the command line\'s',
          o && sameShares(o.shares, lowmoor.demands.map((d) => d.share)), o && JSON.stringify(o.shares));

    // 4. A corrupt file shows an error and keeps the network.
    const bad = path.join(os.tmpdir(), 'apportion-corrupt.json');
    fs.writeFileSync(bad, '{"format": "apportion-network", "version": 1, "nodes": [');
    const chooser2 = b.page.waitForEvent('filechooser');
    await b.act('open');
    const failedOpen = b.next('open-failed');
    await (await chooser2).setFiles(bad);
    const f = await failedOpen;
    check('corrupt file: an error is shown', f && f.messages.length > 0, JSON.stringify(f));
    check('corrupt file: the network is unchanged', f && f.network === lowmoor.network);
    await b.page.screenshot({ path: path.join(artefacts, 'corrupt-file.png') });

    // 5. Share link.
    const linkEvent = b.next('share-link');
    await b.act('share-link');
    shareLink = await linkEvent;
    check('share link: made, with the network in the fragment only', typeof shareLink === 'string' &&
          shareLink.startsWith(`${base}/apportion.html#n=`), String(shareLink));

    // 6. Autosave: a reload restores the relief network.
    const restored = b.next('opened');
    await b.page.goto(`${base}/apportion.html`);
    const r = await restored;
    check('autosave: a reload restores the network', r && r.network === lowmoor.network && r.source === 'autosaved',
          JSON.stringify(r));
    const foreign = b.requests.filter((u) => !u.startsWith(base) && !u.startsWith('data:') && !u.startsWith('blob:'));
    check('nothing leaves the machine', foreign.length === 0, foreign.join(' '));
    await b.close();
  }

  // 7. The share link in a fresh browser profile restores the same network and shares.
  if (shareLink) {
    const b = await browser();
    const opened = b.next('opened');
    await b.page.goto(shareLink);
    const o = await opened;
    check('share link: a fresh profile opens the shared network', o && o.network === lowmoor.network &&
          o.source === 'from a share link', JSON.stringify(o));
    check('share link: the same shares', o && sameShares(o.shares, lowmoor.demands.map((d) => d.share)));
    await b.page.screenshot({ path: path.join(artefacts, 'share-link.png') });
    await b.close();
  }

  // 8. A broken share link shows an error and keeps the demo.
  {
    const b = await browser();
    const failedOpen = b.next('open-failed');
    await b.page.goto(`${base}/apportion.html#n=not-a-network`);
    const f = await failedOpen;
    check('broken share link: an error is shown, the demo stays', f && f.messages.length > 0 &&
          sameShares(f.shares, harrowmere), JSON.stringify(f));
    await b.close();
  }

  // 9. The single file from file://.
  {
    const b = await browser();
    const first = b.next('first-frame');
    const started = Date.now();
    await b.page.goto('file://' + path.join(webDir, 'apportion-single.html'));
    const s = await first;
    check('single file: first frame drawn from file://', s !== null);
    if (s) {
      console.log(`      single file: first frame after ${Date.now() - started} ms`);
      check('single file: demo shares equal the command line\'s', sameShares(s.shares, harrowmere));
    }
    await b.page.waitForTimeout(300);
    await b.page.screenshot({ path: path.join(artefacts, 'single-file.png') });
    const foreign = b.requests.filter((u) => !u.startsWith('file://') && !u.startsWith('data:'));
    check('single file: no request leaves the machine', foreign.length === 0, foreign.join(' '));
    await b.close();
  }
} finally {
  server.close();
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed ? 1 : 0);
