// Browser tests of the Apportion page in Debian's chromium (headless, SwiftShader WebGL2),
// driven by playwright-core. The page reports events on the console as
// "apportion:<event> {json}" and runs a button's action through the exported
// apportion_test_action(); canvas edits use the real mouse and keyboard at node positions the
// page reports, so no test guesses pixels. Screenshots and measurements go to the artefacts
// folder.
//
// usage: node app.mjs --web DIR --root REPO --expected DIR --artefacts DIR
//   DIR of --expected holds the command line's results: <demo>.fair.json for each demo.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import os from 'node:os';
import zlib from 'node:zlib';
import { chromium } from 'playwright-core';
import { grid, hostile } from './networks.mjs';

const arg = (name) => { const i = process.argv.indexOf(name); return i > 0 ? process.argv[i + 1] : undefined; };
const webDir = path.resolve(arg('--web'));
const root = path.resolve(arg('--root'));
const expectedDir = path.resolve(arg('--expected'));
const artefacts = path.resolve(arg('--artefacts'));
fs.mkdirSync(artefacts, { recursive: true });
const expected = (demo) => JSON.parse(fs.readFileSync(path.join(expectedDir, `${demo}.fair.json`), 'utf8'));
const demoFile = (demo) => path.join(root, 'demo-networks', `${demo}.json`);
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'apportion-browser-'));
const writeTmp = (name, text) => { const f = path.join(tmp, name); fs.writeFileSync(f, text); return f; };
const measurements = {};

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
const sameShares = (a, b) => Array.isArray(a) && a.length === b.length &&
  a.every((x, i) => Math.abs(x - b[i]) <= 1e-6 * Math.max(1, Math.abs(b[i])));

// Page helpers: events() waits for the next console event of a kind; act() runs an action.
function instrument(page) {
  const requests = [];
  page.on('request', (r) => requests.push(r.url()));
  const seen = [];
  const waiters = [];
  const dialogs = [];
  page.on('dialog', (d) => { dialogs.push(d.message()); d.dismiss().catch(() => {}); });
  // What a user would see in the browser's console: errors, warnings, failed loads. Chromium's
  // own "GL Driver Message" lines come from its software WebGL (SwiftShader, headless), not
  // from the page, and are left out.
  const problems = [];
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('response', (r) => { if (r.status() >= 400) problems.push(`HTTP ${r.status()} ${r.url()}`); });
  page.on('console', (m) => {
    const t = m.text();
    if ((m.type() === 'error' || m.type() === 'warning') && !t.includes('GL Driver Message'))
      problems.push(`${m.type()}: ${t.slice(0, 300)}`);
    const match = /^apportion:([a-z-]+) (.*)$/s.exec(t);
    if (!match) return;
    let data = match[2];
    try { data = JSON.parse(match[2]); } catch (e) { /* a plain text event, e.g. share-link */ }
    const ev = { kind: match[1], data };
    seen.push(ev);
    for (const w of waiters.splice(0)) if (!w(ev)) waiters.push(w);
  });
  const next = (kind, timeout = 60000) => new Promise((resolve) => {
    const timer = setTimeout(() => resolve(null), timeout);
    waiters.push((ev) => { if (ev.kind !== kind) return false; clearTimeout(timer); resolve(ev.data); return true; });
  });
  const act = (what) => page.evaluate((w) => {
    const len = Module.lengthBytesUTF8(w) + 1, ptr = Module._malloc(len);
    Module.stringToUTF8(w, ptr, len);
    Module._apportion_test_action(ptr);
    Module._free(ptr);
  }, what);
  const positions = async () => { const p = next('positions'); await act('positions'); return p; };
  const state = async () => { const p = next('state'); await act('state'); return p; };
  return { page, requests, next, act, positions, state, seen, dialogs, problems };
}

// A browser with a fresh profile. Device pixel ratio 2 checks HiDPI; frame-rate checks use
// 1, because headless chromium draws WebGL in software (SwiftShader), where the cost of
// a frame grows with the pixel count and says nothing about the page's own work.
async function browser(deviceScaleFactor = 2) {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'apportion-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium', headless: true, args: flags, deviceScaleFactor,
    acceptDownloads: true, viewport: { width: 1400, height: 860 } });
  const page = context.pages()[0] || await context.newPage();
  const close = async () => { await context.close(); fs.rmSync(profile, { recursive: true, force: true }); };
  return { ...instrument(page), context, close };
}

async function openFile(b, file, event = 'opened') {
  const chooser = b.page.waitForEvent('filechooser');
  await b.act('open');
  const ev = b.next(event);
  await (await chooser).setFiles(file);
  return ev;
}

// Frames the page draws in `ms`, counted with requestAnimationFrame: frame rate and the
// longest gap between two frames.
const frameStats = (page, ms) => page.evaluate((ms) => new Promise((done) => {
  const t = [];
  const tick = (now) => { t.push(now); if (now - t[0] < ms) requestAnimationFrame(tick); else {
    const gaps = t.slice(1).map((x, i) => x - t[i]).sort((a, b) => a - b);
    done({ fps: (t.length - 1) / ((t[t.length - 1] - t[0]) / 1000), longest: gaps[gaps.length - 1],
           median: gaps[Math.floor(gaps.length / 2)] });
  } };
  requestAnimationFrame(tick);
}), ms);

// Reads an 8-bit RGB or RGBA PNG (W3C PNG specification, 2nd edition: chunks, zlib data,
// per-line filters 0-4), enough for screenshots and the page's own PNG export.
function readPng(buffer) {
  let pos = 8, width = 0, height = 0, channels = 0;
  const data = [];
  while (pos < buffer.length) {
    const len = buffer.readUInt32BE(pos), type = buffer.toString('latin1', pos + 4, pos + 8);
    const body = buffer.subarray(pos + 8, pos + 8 + len);
    if (type === 'IHDR') {
      width = body.readUInt32BE(0); height = body.readUInt32BE(4);
      if (body[8] !== 8 || (body[9] !== 2 && body[9] !== 6) || body[12] !== 0) throw new Error('unsupported PNG');
      channels = body[9] === 6 ? 4 : 3;
    } else if (type === 'IDAT') data.push(body);
    pos += 12 + len;
  }
  const raw = zlib.inflateSync(Buffer.concat(data)), stride = width * channels;
  const px = Buffer.alloc(height * stride);
  for (let y = 0; y < height; y++) {
    const f = raw[y * (stride + 1)], line = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    for (let x = 0; x < stride; x++) {
      const a = x >= channels ? px[y * stride + x - channels] : 0, b = y > 0 ? px[(y - 1) * stride + x] : 0;
      const c = x >= channels && y > 0 ? px[(y - 1) * stride + x - channels] : 0;
      const pa = Math.abs(b - c), pb = Math.abs(a - c), pc = Math.abs(a + b - 2 * c);
      const pred = [0, a, b, (a + b) >> 1, pa <= pb && pa <= pc ? a : pb <= pc ? b : c][f];
      px[y * stride + x] = (line[x] + pred) & 255;
    }
  }
  // Mean luma (ITU-R BT.709) of a box, 0..1.
  const luma = (x0, y0, x1, y1) => {
    let sum = 0, n = 0;
    for (let y = Math.max(0, y0 | 0); y < Math.min(height, y1 | 0); y++)
      for (let x = Math.max(0, x0 | 0); x < Math.min(width, x1 | 0); x++) {
        const i = y * stride + x * channels;
        sum += (0.2126 * px[i] + 0.7152 * px[i + 1] + 0.0722 * px[i + 2]) / 255; n++;
      }
    return n ? sum / n : NaN;
  };
  return { width, height, luma };
}

const harrowmere = expected('harrowmere-fibre').demands.map((d) => d.share);
const lowmoor = expected('lowmoor-relief-roads');
let shareLink = null;

try {
  // 1. Served page: first frame, then the demo's shares from the worker equal the command line's.
  {
    const b = await browser();
    const first = b.next('first-frame');
    const solved = b.next('solved');
    const started = Date.now();
    await b.page.goto(`${base}/apportion.html`);
    const s = await first;
    check('served: first frame drawn', s !== null);
    measurements.first_frame_served_ms = Date.now() - started;
    console.log(`      served: first frame after ${measurements.first_frame_served_ms} ms`);
    check('served: sharp on HiDPI (device pixel ratio 2 used)', s && s.dpr === 2);
    const r = await solved;
    check('served: demo shares (solved in the worker) equal the command line\'s',
          r && r.status === 'optimal' && sameShares(r.shares, harrowmere), JSON.stringify(r && r.shares));
    const csp = await b.page.evaluate(() => {
      const m = document.querySelector('meta[http-equiv="Content-Security-Policy"]');
      return m ? m.content : '';
    });
    check('page sets a restrictive Content-Security-Policy', csp.includes("default-src 'none'") &&
          csp.includes("connect-src 'self'") && !csp.includes('*'), csp);
    const unzoomed = await b.positions();
    await b.page.mouse.move(900, 450);
    await b.page.mouse.wheel(0, -240);  // a zoom
    await b.page.waitForTimeout(300);
    const zoomed = await b.positions();
    const [zid] = Object.keys(unzoomed.nodes);
    check('served: the wheel zooms the canvas', zoomed && unzoomed &&
          JSON.stringify(zoomed.nodes[zid]) !== JSON.stringify(unzoomed.nodes[zid]), JSON.stringify([unzoomed.nodes[zid], zoomed.nodes[zid]]));
    await b.act('fit');  // the view as before, for the clicks below
    check('served: a clean console after load, solve and zoom (no error, warning or failed load)',
          b.problems.length === 0, JSON.stringify(b.problems));
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
    const svgDl = b.page.waitForEvent('download');
    await b.act('export-svg');
    const svgDownload = await svgDl;
    const svg = fs.readFileSync(await svgDownload.path(), 'utf8');
    check('SVG export: a picture with a legend and the caution', svg.startsWith('<svg') &&
          svg.includes('arc utilisation') && svg.includes('planning aid'));
    const pngDl = b.page.waitForEvent('download');
    await b.act('export-png');
    const pngDownload = await pngDl;
    const png = fs.readFileSync(await pngDownload.path());
    check('PNG export: a PNG image of the canvas', png.length > 1000 && png.subarray(1, 4).toString() === 'PNG',
          `${png.length} bytes`);
    const names = [download.suggestedFilename(), svgDownload.suggestedFilename(), pngDownload.suggestedFilename()];
    check('exports: file names follow one pattern, <network name, hyphenated>.<what>.<ext>',
          JSON.stringify(names) === JSON.stringify(['Harrowmere-Province-regional-fibre-backbone.demands.csv',
            'Harrowmere-Province-regional-fibre-backbone.picture.svg', 'Harrowmere-Province-regional-fibre-backbone.canvas.png']),
          JSON.stringify(names));
    fs.writeFileSync(path.join(artefacts, 'exported.png'), png);
    fs.writeFileSync(path.join(artefacts, 'exported.svg'), svg);

    // 3. Editing on the canvas with the mouse and keyboard, with undo and redo.
    let pos = await b.positions();
    const [hx, hy] = pos.nodes.HRW;
    let sel = b.next('selected');
    await b.page.mouse.click(hx, hy);
    let st = await sel;
    check('canvas: a click selects the node under the mouse', st && st.selection.nodes.join() === 'HRW',
          JSON.stringify(st && st.selection));
    await b.page.mouse.move(hx, hy);
    await b.page.mouse.down();
    for (let i = 1; i <= 8; i++) await b.page.mouse.move(hx + 5 * i, hy + 4 * i);
    await b.page.mouse.up();
    await b.page.waitForTimeout(100);
    pos = await b.positions();
    st = await b.state();
    check('canvas: dragging moves the node', Math.abs(pos.nodes.HRW[0] - (hx + 40)) < 3 &&
          Math.abs(pos.nodes.HRW[1] - (hy + 32)) < 3 && st.undo === 'move 1 node', JSON.stringify([pos.nodes.HRW, st.undo]));
    await b.page.keyboard.press('Control+z');
    await b.page.waitForTimeout(100);
    pos = await b.positions();
    check('canvas: Ctrl+Z puts the node back', Math.abs(pos.nodes.HRW[0] - hx) < 1 && Math.abs(pos.nodes.HRW[1] - hy) < 1,
          JSON.stringify(pos.nodes.HRW));
    await b.page.keyboard.press('Control+y');
    await b.page.waitForTimeout(100);
    pos = await b.positions();
    check('canvas: Ctrl+Y moves it again', Math.abs(pos.nodes.HRW[0] - (hx + 40)) < 3, JSON.stringify(pos.nodes.HRW));

    // Add an arc with the tool: click its tail, then its head; the page re-solves.
    const before = await b.state();
    await b.act('tool add-arc');
    const [cx, cy] = pos.nodes.CAL, [dx, dy] = pos.nodes.DUN;
    await b.page.mouse.click(cx, cy);
    const edited = b.next('edited');
    const resolved = b.next('solved');
    await b.page.mouse.click(dx, dy);
    const e1 = await edited;
    check('add-arc tool: one more arc, CAL to DUN', e1 && e1.arcs === before.arcs + 1 && e1.undo === 'add an arc',
          JSON.stringify(e1));
    const r1 = await resolved;
    check('add-arc tool: the page solves again, and CAL->DUN raises d-north', r1 && r1.status === 'optimal' &&
          r1.shares[0] > harrowmere[0] + 1e-9, JSON.stringify(r1 && r1.shares));
    // Delete it with the Delete key; undo brings it back, redo removes it again.
    await b.act('tool select');
    let ev = b.next('edited');
    await b.page.keyboard.press('Delete');
    let e2 = await ev;
    check('Delete removes the selected arc', e2 && e2.arcs === before.arcs, JSON.stringify(e2));
    ev = b.next('edited');
    await b.page.keyboard.press('Control+z');
    e2 = await ev;
    check('undo restores it', e2 && e2.arcs === before.arcs + 1 && e2.redo === 'delete 1 item', JSON.stringify(e2));
    ev = b.next('edited');
    let back = b.next('solved');
    await b.page.keyboard.press('Control+Shift+z');
    e2 = await ev;
    const r2 = await back;
    check('redo removes it again, and the shares are the command line\'s again',
          e2 && e2.arcs === before.arcs && r2 && sameShares(r2.shares, harrowmere), JSON.stringify(r2 && r2.shares));

    // Add a node where clicked, and select a box of nodes.
    await b.act('tool add-node');
    ev = b.next('edited');
    const box = pos.canvas;
    await b.page.mouse.click(box[0] + box[2] - 40, box[1] + 40);
    e2 = await ev;
    check('add-node tool: a node where clicked', e2 && e2.nodes === before.nodes + 1, JSON.stringify(e2));
    await b.act('tool select');
    pos = await b.positions();
    const box2 = pos.canvas;
    check('the canvas stays in place when messages appear', box2.join() === box.join(), JSON.stringify([box, box2]));
    const inBox = Object.entries(pos.nodes).filter(([, [x, y]]) => x < hx + 60 && y < hy + 60 && x > box[0] && y > box[1]);
    sel = b.next('selected');
    await b.page.mouse.move(box[0] + 3, box[1] + 3);
    await b.page.mouse.down();
    for (let i = 1; i <= 5; i++) await b.page.mouse.move(box[0] + 3 + (hx + 60 - box[0] - 3) * i / 5, box[1] + 3 + (hy + 60 - box[1] - 3) * i / 5);
    await b.page.mouse.up();
    st = await sel;
    check(`box selection: the ${inBox.length} nodes inside the box`, st && inBox.length > 0 &&
          st.selection.nodes.slice().sort().join() === inBox.map(([id]) => id).sort().join(),
          JSON.stringify([st && st.selection.nodes, inBox.map(([id]) => id)]));
    ev = b.next('edited');
    await b.act('undo');  // the new node goes again
    await ev;

    // What a failure changes: take an arc out of service; shares drop; the change is shown.
    await b.act('set arc l1-ab enabled false');
    const failedShares = await b.next('solved');
    check('failure what-if: taking l1-ab out changes the shares', failedShares && failedShares.status === 'optimal' &&
          !sameShares(failedShares.shares, harrowmere), JSON.stringify(failedShares && failedShares.shares));
    check('failure what-if: the change column names the edit it follows',
          failedShares && failedShares.change === 'change: since the result before "enabled of arc l1-ab"',
          JSON.stringify(failedShares && failedShares.change));
    await b.page.waitForTimeout(200);
    const failedView = await b.positions();
    check('failure what-if: the arc out of service is drawn dashed and crossed, and only it',
          failedView && JSON.stringify(failedView.out_of_service) === '["l1-ab"]', JSON.stringify(failedView && failedView.out_of_service));
    await b.page.screenshot({ path: path.join(artefacts, 'failure-what-if.png') });
    back = b.next('solved');
    await b.act('undo');
    const restoredShares = await back;
    check('undo of the failure restores the shares', restoredShares && sameShares(restoredShares.shares, harrowmere));
    // One demand shown on the canvas: its origin and destination are marked.
    const north = expected('harrowmere-fibre').demands.find((d) => d.id === 'd-north');
    await b.act('show demand d-north');
    await b.page.waitForTimeout(200);
    const shown = await b.positions();
    check('show one demand: its origin and destination are marked on the canvas',
          shown && shown.origin === north.origin && shown.destination === north.destination && shown.out_of_service.length === 0,
          JSON.stringify(shown && [shown.origin, shown.destination, north.origin, north.destination]));
    await b.page.screenshot({ path: path.join(artefacts, 'one-demand.png') });
    await b.act('show demand none');
    // A rule switch: the change column compares with the other rule's result, and says so.
    back = b.next('solved');
    await b.act('objective 2');
    const ruled = await back;
    check('rule switch: the change column names the rule it compares with',
          ruled && ruled.change === 'change: since the result under "Max-min fair shares (weighted)"',
          JSON.stringify(ruled && ruled.change));
    back = b.next('solved');
    await b.act('objective 0');
    await back;
    // "prove fairness": the certificate runs in the worker after the solve, and its verdict
    // comes back with the result (every share proven to 1e-6 of the largest).
    back = b.next('solved');
    await b.act('certify on');
    await back;
    const proven = await b.state();
    await b.page.screenshot({ path: path.join(artefacts, 'prove-fairness.png') });
    check('prove fairness: every share proven in the page', proven && proven.fairness &&
          proven.fairness.status === 'optimal' && proven.fairness.max_relative_error <= 1e-6 &&
          proven.fairness.bounds === proven.shares.length && proven.shares.length > 0, JSON.stringify(proven && proven.fairness));
    back = b.next('solved');
    await b.act('certify off');
    await back;
    const plain = await b.state();
    check('prove fairness off: no certificate', plain && plain.status === 'optimal' && !plain.fairness,
          JSON.stringify(plain && plain.fairness));

    // An invalid edit is not solved; its message selects the item.
    ev = b.next('invalid');
    await b.act('set demand d-east weight 0');
    const inv = await ev;
    check('invalid network: not solved, the error is listed', inv && inv.errors.length > 0 &&
          inv.status === 'not solved', JSON.stringify(inv));
    sel = b.next('selected');
    await b.act('select-diagnostic 0');
    st = await sel;
    check('clicking the message selects its demand', st && st.selection.demands.join() === 'd-east', JSON.stringify(st));
    await b.page.screenshot({ path: path.join(artefacts, 'invalid-edit.png') });
    back = b.next('solved');
    await b.act('undo');
    await back;

    // 4. Open another network through the file picker.
    const openedSolved = b.next('solved');
    const o = await openFile(b, demoFile('lowmoor-relief-roads'));
    check('open: the relief network replaces the demo', o && o.network === lowmoor.network, JSON.stringify(o));
    const os1 = await openedSolved;
    check('open: its shares equal the command line\'s', os1 && sameShares(os1.shares, lowmoor.demands.map((d) => d.share)),
          os1 && JSON.stringify(os1.shares));
    check('open: no change column against the network opened before', os1 && os1.change === '',
          JSON.stringify(os1 && os1.change));

    // 5. A corrupt file shows an error and keeps the network.
    const f = await openFile(b, writeTmp('corrupt.json', '{"format": "apportion-network", "version": 1, "nodes": ['), 'open-failed');
    check('corrupt file: an error is shown', f && f.messages.length > 0, JSON.stringify(f));
    check('corrupt file: the network is unchanged', f && f.network === lowmoor.network);
    await b.page.screenshot({ path: path.join(artefacts, 'corrupt-file.png') });
    // Many errors: wrapped, in a box that scrolls, so that the tabs stay in sight.
    const badArcs = Array.from({ length: 60 }, (_, i) =>
      `{"id": "bad-${i}", "from": "nowhere-${i}", "to": "elsewhere-${i}", "capacity": 1}`).join(',');
    const many = await openFile(b, writeTmp('many-errors.json', `{"format": "apportion-network", "version": 1,
      "nodes": [{"id": "a"}], "arcs": [${badArcs}], "demands": []}`), 'open-failed');
    const afterMany = await b.state();
    check('many file errors: listed, and the tabs stay in the upper half of the window',
          many && many.messages.length >= 20 && afterMany.tabs_y < afterMany.window[1] / 2,
          JSON.stringify([many && many.messages.length, afterMany.tabs_y, afterMany.window]));
    await b.page.screenshot({ path: path.join(artefacts, 'many-file-errors.png') });

    // 6. Share link: copied to the clipboard and said so; the address bar keeps no fragment,
    // so an edit made after copying survives a reload (the autosave opens, not the link).
    await b.context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: base });
    const linkEvent = b.next('share-link');
    const copiedEvent = b.next('share-copied');
    await b.act('share-link');
    shareLink = await linkEvent;
    const copied = await copiedEvent;
    check('share link: made, with the network in the fragment only', typeof shareLink === 'string' &&
          shareLink.startsWith(`${base}/apportion.html#n=`), String(shareLink));
    const clip = await b.page.evaluate(() => navigator.clipboard.readText());
    check('share link: copied to the clipboard, and the page says so', clip === shareLink && copied &&
          copied.notice.startsWith('Share link copied'), JSON.stringify(copied && copied.notice));
    check('share link: the address bar keeps no fragment', !b.page.url().includes('#'), b.page.url());
    let ed = b.next('edited');
    await b.act('set network - name edited after sharing');
    await ed;
    const reopened = b.next('opened');
    await b.page.reload();
    const ro6 = await reopened;
    check('share link: an edit made after copying the link survives a reload (autosave, not the link)',
          ro6 && ro6.source === 'autosaved' && ro6.network === 'edited after sharing', JSON.stringify(ro6));
    ed = b.next('edited');
    await b.act(`set network - name ${lowmoor.network}`);
    await ed;

    // 7. Autosave: a reload restores the relief network; earlier versions are kept.
    const versions = JSON.parse(await b.page.evaluate(() => apportionBridge.autosaveList()));
    check('autosave keeps earlier versions (newest first)', versions.length >= 2 && versions.length <= 5 &&
          versions[0].time >= versions[1].time, JSON.stringify(versions.map((v) => [v.name, v.time])));
    const restored = b.next('opened');
    await b.page.goto(`${base}/apportion.html`);
    const rr = await restored;
    check('autosave: a reload restores the network', rr && rr.network === lowmoor.network && rr.source === 'autosaved',
          JSON.stringify(rr));
    const foreign = b.requests.filter((u) => !u.startsWith(base) && !u.startsWith('data:') && !u.startsWith('blob:'));
    check('nothing leaves the machine', foreign.length === 0, foreign.join(' '));

    // 8. Two tabs: the second tab's save is noticed by the first, and both versions are kept.
    const other = instrument(await b.context.newPage());
    const otherOpened = other.next('opened');
    await other.page.goto(`${base}/apportion.html`);
    await otherOpened;
    const firstTabSaved = b.next('edited');
    await b.act('set node depot label first tab');   // tab 1 saves
    await firstTabSaved;
    const warned = b.next('other-tab-saved', 10000);
    await other.act('set node depot label second tab');  // tab 2 saves over it
    const w = await warned;
    check('two tabs: the first tab is warned when the second saves', w !== null && w.other_tab_saved === true,
          JSON.stringify(w));
    const tabs = JSON.parse(await b.page.evaluate(() => apportionBridge.autosaveList()));
    check('two tabs: both tabs\' versions are kept', new Set(tabs.map((v) => v.tab)).size >= 2, JSON.stringify(tabs));
    await other.page.close();

    // 9. A crash: the renderer dies without running any unload handler; a new tab restores
    // the last edit from the autosave.
    const savedBeforeCrash = b.next('edited');
    await b.act('set node depot label saved before the crash');
    await savedBeforeCrash;
    const crashed = b.page.waitForEvent('crash', { timeout: 15000 }).then(() => true, () => false);
    const cdp = await b.context.newCDPSession(b.page);
    cdp.send('Page.crash').catch(() => {});
    const didCrash = await crashed;
    const revived = instrument(await b.context.newPage());
    const revivedOpened = revived.next('opened');
    await revived.page.goto(`${base}/apportion.html`);
    const ro = await revivedOpened;
    const saveDl = revived.page.waitForEvent('download');
    await revived.act('save-network');
    const savedText = fs.readFileSync(await (await saveDl).path(), 'utf8');
    check('autosave: after a crash a new tab restores the last edit', didCrash && ro && ro.source === 'autosaved' &&
          savedText.includes('saved before the crash'), JSON.stringify([didCrash, ro && ro.source]));

    // 10. A full storage is reported, not silent.
    await revived.page.evaluate(() => {
      Storage.prototype.setItem = function () { throw new DOMException('full', 'QuotaExceededError'); };
    });
    const quota = revived.next('autosave-failed', 10000);
    await revived.act('set node depot label storage is full');
    const q = await quota;
    check('autosave: a full storage is reported in the page', q && q.notice.includes('Autosave failed'), JSON.stringify(q));
    await b.close();
  }

  // 10. The share link in a fresh browser profile restores the same network and shares.
  if (shareLink) {
    const b = await browser();
    const opened = b.next('opened');
    const solved = b.next('solved');
    await b.page.goto(shareLink);
    const o = await opened;
    check('share link: a fresh profile opens the shared network', o && o.network === lowmoor.network &&
          o.source === 'from a share link', JSON.stringify(o));
    const s = await solved;
    check('share link: the same shares', s && sameShares(s.shares, lowmoor.demands.map((d) => d.share)));
    check('share link: once opened, the fragment leaves the address bar', !b.page.url().includes('#'), b.page.url());
    await b.page.screenshot({ path: path.join(artefacts, 'share-link.png') });
    await b.close();
  }

  // 10b. A traffic matrix in one step: all pairs by the gravity model, one undo; then the
  // same amount between two selected nodes; a selection of one node is refused by name.
  {
    const b = await browser();
    const solved = b.next('solved');
    await b.page.goto(`${base}/apportion.html`);
    await solved;
    const start = await b.state();
    await b.act('matrix-dialog');
    await b.page.waitForTimeout(300);
    await b.page.screenshot({ path: path.join(artefacts, 'matrix-dialog.png') });
    await b.page.keyboard.press('Escape');  // the dialog closes; the actions below run its Add
    let ev = b.next('edited');
    let re = b.next('solved');
    await b.act('matrix gravity all 400 1 1 replace');
    let e = await ev;
    const n = start.nodes;
    check(`matrix dialog: all ${n * (n - 1)} ordered pairs by the gravity model, one undo step`,
          e && e.demands === n * (n - 1) && e.undo === `add ${n * (n - 1)} demands (gravity)`, JSON.stringify(e));
    const r = await re;
    check('matrix dialog: the page solves the whole matrix', r && r.status === 'optimal' && r.shares.length === n * (n - 1),
          JSON.stringify(r && [r.status, r.shares.length]));
    ev = b.next('edited');
    await b.act('undo');
    e = await ev;
    check('matrix dialog: one undo takes every new demand back', e && e.demands === start.demands, JSON.stringify(e));
    await b.page.waitForTimeout(300);
    // The demands as a matrix CSV: exported, edited as a spreadsheet would, opened again
    // to add its demands to the network (one undo step); a matrix naming no node is refused.
    const mdl = b.page.waitForEvent('download');
    await b.act('export-matrix-csv');
    const mtext = fs.readFileSync(await (await mdl).path(), 'utf8').trim().split(/\r?\n/);
    check('matrix export: one row per node after the header, the demo\'s 4 demands in its cells',
          mtext.length === n + 1 && mtext.slice(1).join(',').split(',').filter((c) => c !== '').length === n + 4,
          JSON.stringify(mtext.slice(0, 3)));
    const ids = mtext[0].split(',').slice(1);
    ev = b.next('edited');
    const added = b.next('matrix-added');
    await openFile(b, writeTmp('plan.matrix.csv', `,${ids[1]},${ids[2]}\n${ids[0]},7,max\n${ids[1]},,2\n`), 'matrix-added');
    e = await ev;
    const ma = await added;
    check('matrix import: a CSV matrix opened in the page adds its 3 demands, one undo step',
          e && e.demands === start.demands + 3 && e.undo === 'add 3 demands from plan.matrix.csv', JSON.stringify(e || ma));
    ev = b.next('edited');
    await b.act('undo');
    e = await ev;
    const bad = await openFile(b, writeTmp('other.matrix.csv', ',nowhere\nnobody,1\n'), 'open-failed');
    check('matrix import: names that match no node are refused by line and column, the network unchanged',
          bad && bad.messages.some((m) => m.includes("column 2 (nowhere)")) && bad.demands === start.demands,
          JSON.stringify(bad && bad.messages));

    const pos = await b.positions();
    const [[id1, [x1, y1]], [id2, [x2, y2]]] = Object.entries(pos.nodes);
    let sel = b.next('selected');
    await b.page.mouse.move(x1, y1);
    await b.page.mouse.click(x1, y1);
    await sel;
    sel = b.next('selected');
    await b.page.keyboard.down('Shift');
    await b.page.mouse.move(x2, y2);
    await b.page.mouse.click(x2, y2);
    await sel;
    await b.page.keyboard.up('Shift');
    ev = b.next('edited');
    await b.act('matrix uniform selected 5 1 2 keep');
    e = await ev;
    const st = await b.state();
    check(`matrix dialog: between the 2 selected nodes (${id1}, ${id2}), both directions added`,
          e && e.demands === start.demands + 2 && st.selection.nodes.length === 2, JSON.stringify([e, st.selection]));
    sel = b.next('selected');
    await b.page.mouse.move(x1, y1);
    await b.page.mouse.click(x1, y1);
    await sel;
    const refused = b.next('matrix-refused');
    await b.act('matrix max selected 0 1 1 keep');
    const f = await refused;
    check('matrix dialog: one selected node is refused, saying why', f && f.notice.includes('at least two nodes') &&
          f.demands === start.demands + 2, JSON.stringify(f));

    // From the one selected node to every other node (a hub's demands).
    ev = b.next('edited');
    await b.act('matrix uniform from-selected 1 1 1 keep');
    e = await ev;
    check(`matrix dialog: from the selected node ${id1} to each of the other ${n - 1} nodes`,
          e && e.demands === start.demands + 2 + (n - 1) && e.undo === `add ${n - 1} demands (same amount)`, JSON.stringify(e));
    ev = b.next('edited');
    await b.act('undo');
    await ev;

    // A demands table pasted from a spreadsheet (tab-separated, the browser's paste event):
    // the dialog opens with a preview, Add adds its rows as one undo step; a table naming no
    // node is refused by row and column.
    const paste = (text) => b.page.evaluate((t) => {
      const dt = new DataTransfer();
      dt.setData('text/plain', t);
      document.dispatchEvent(new ClipboardEvent('paste', { clipboardData: dt, bubbles: true, cancelable: true }));
    }, text);
    const pasted = b.next('table-pasted');
    await paste(`From\tTo\tAmount\tWeight\r\n${id1}\t${id2}\t3\t2\r\n${id2}\t${id1}\t\t\r\n`);
    check('paste: a spreadsheet\'s demands table opens the Add demands dialog', !!(await pasted));
    await b.page.waitForTimeout(300);
    await b.page.screenshot({ path: path.join(artefacts, 'pasted-table.png') });
    await b.page.keyboard.press('Escape');
    ev = b.next('edited');
    await b.act('table-add keep');
    e = await ev;
    let st2 = await b.state();
    check('paste: Add puts the 2 pasted rows into the network as one undo step',
          e && e.demands === start.demands + 4 && e.undo === 'add 2 demands from a pasted table', JSON.stringify(e));
    ev = b.next('edited');
    await b.act('undo');
    e = await ev;
    check('paste: one undo takes the pasted rows back', e && e.demands === start.demands + 2, JSON.stringify(e));
    await paste(`origin,destination\n${id1},nowhere\n`);
    const tref = b.next('table-refused');
    await b.act('table-add keep');
    const tr = await tref;
    check('paste: a table naming no node is refused by row and column, the network unchanged',
          tr && tr.notice.includes("row '2'") && tr.notice.includes('column 2 (destination)') && tr.demands === start.demands + 2,
          JSON.stringify(tr && tr.notice));
    const notTable = b.next('paste-refused');
    await paste('just some words');
    const nt = await notTable;
    check('paste: text that is not a table is refused, saying what a table needs',
          nt && nt.notice.includes('origin and destination'), JSON.stringify(nt && nt.notice));
    // A demands CSV opened alone: shown in the dialog, then added.
    await openFile(b, writeTmp('extra.demands.csv', `id,origin,destination,amount\nx1,${id2},${id1},4\n`), 'table-opened');
    ev = b.next('edited');
    await b.act('table-add keep');
    e = await ev;
    st2 = await b.state();
    check('open: a demands CSV alone adds its rows to the open network (one undo step)',
          e && e.demands === start.demands + 3 && e.undo === 'add 1 demands from extra.demands.csv', JSON.stringify(e));
    ev = b.next('edited');
    await b.act('undo');
    await ev;

    // The network's name and units are edited in the page, with undo.
    ev = b.next('edited');
    await b.act('set network - name Harrowmere east, 2027 plan');
    e = await ev;
    ev = b.next('edited');
    await b.act('set network - capacity-unit Tbit/s');
    await ev;
    const renamed = await b.state();
    const svgName = b.page.waitForEvent('download');
    await b.act('export-svg');
    const named = fs.readFileSync(await (await svgName).path(), 'utf8');
    check('network name and unit: edited in the page, used by the exports', e && e.network === 'Harrowmere east, 2027 plan' &&
          renamed.undo === 'capacity unit' && named.includes('Harrowmere east, 2027 plan') && named.includes('Tbit/s'),
          JSON.stringify([e && e.network, renamed.undo]));
    ev = b.next('edited');
    await b.act('undo');
    await ev;
    ev = b.next('edited');
    await b.act('undo');
    e = await ev;
    check('network name: undo restores it', e && e.network === start.network, JSON.stringify(e && e.network));

    // A long solve pauses "solve after each edit" (threshold lowered to 1 ms for the test;
    // the page's own is 3 s), says so, and an edit then starts no solve until asked.
    await b.act('auto-solve-pause-ms 1');
    const paused = b.next('auto-solve-paused');
    await b.act('matrix gravity all 0 2 1 replace');
    const pz = await paused;
    check('a long solve pauses solving after each edit, and says so', pz && pz.auto_solve === false &&
          pz.notice.includes('is paused'), JSON.stringify(pz && [pz.auto_solve, pz.notice]));
    const noSolve = b.next('solve-started', 2000);
    await b.act('undo');
    check('while paused, an edit starts no solve', (await noSolve) === null && (await b.state()).status === 'not solved');
    const asked = b.next('solved');
    await b.act('solve');
    check('while paused, Solve still solves', (await asked) !== null);
    await b.close();
  }

  // 10c. A GraphML topology: the page asks which attribute holds capacity and in what unit,
  // reads link speeds in Mbit/s into Gbit/s, and says how many links got the default.
  {
    const b = await browser();
    await b.page.goto(`${base}/apportion.html`);
    await b.next('solved');
    const topo = writeTmp('speeds.graphml', `<graphml><key id="s" for="edge" attr.name="LinkSpeed"/>
<key id="l" for="node" attr.name="label"/><graph id="Ridgeway backbone" edgedefault="undirected">
<node id="a"><data key="l">Ashby</data></node><node id="b"/><node id="c"/>
<edge source="a" target="b"><data key="s">2500</data></edge><edge source="b" target="c"/></graph></graphml>`);
    const choices = await openFile(b, topo, 'import-choices');
    check('GraphML: the page lists the edge attributes and guesses the link speed', choices &&
          choices.attributes.length === 1 && choices.attributes[0].name === 'LinkSpeed' && choices.attributes[0].edges === 1 &&
          choices.guess === 0, JSON.stringify(choices));
    await b.page.waitForTimeout(300);
    await b.page.screenshot({ path: path.join(artefacts, 'graphml-choices.png') });
    const refused = b.next('open-failed');
    await b.act('import-graphml LinkSpeed Mbit/s t/day 10 pairs');
    const f = await refused;
    check('GraphML: a link speed cannot be converted to a unit that is not one, and says so',
          f && f.notice.includes("'t/day' is not a link speed unit") && f.network !== 'Ridgeway backbone', JSON.stringify(f && f.notice));
    const opened = b.next('opened');
    await b.act('import-graphml LinkSpeed Mbit/s Gbit/s 10 pairs');
    const o = await opened;
    const saved = b.page.waitForEvent('download');
    await b.act('save-network');
    const net = JSON.parse(fs.readFileSync(await (await saved).path(), 'utf8'));
    check('GraphML: opened with 2.5 Gbit/s from 2500 Mbit/s, the default 10, two arcs per link, and the warning shown',
          o && o.network === 'Ridgeway backbone' && net.units.capacity === 'Gbit/s' &&
          JSON.stringify(net.arcs.map((x) => x.capacity)) === '[2.5,2.5,10,10]' && o.notice.includes('1 of 2 edges'),
          JSON.stringify([o && o.notice, net.arcs.map((x) => x.capacity), net.units]));
    await b.close();
  }

  // 10d. A 40,000-demand table: it scrolls while the page keeps drawing, and filters and sorts.
  {
    const b = await browser(1);
    await b.page.goto(`${base}/apportion.html`);
    await b.next('solved');
    const started = b.next('solve-started');
    await openFile(b, writeTmp('forty-thousand.json', grid(15, 40000, 5, 'Forty thousand demands', 6)));
    await started;
    await b.act('cancel');  // the table needs no solve
    await b.act('tab 2');
    await b.page.waitForTimeout(300);
    await b.page.mouse.move(300, 500);
    const scrolling = (async () => { for (let i = 0; i < 20; i++) { await b.page.mouse.wheel(0, 3000); await b.page.waitForTimeout(50); } })();
    const fr = await frameStats(b.page, 1500);
    await scrolling;
    measurements.table_40000_demands = fr;
    console.log(`      40,000 demands: ${fr.fps.toFixed(1)} fps while scrolling the table (longest frame gap ${fr.longest.toFixed(0)} ms)`);
    check('40,000-demand table: scrolls while the page keeps drawing (no frame gap over 1 s)', fr.longest < 1000, JSON.stringify(fr));
    await b.page.screenshot({ path: path.join(artefacts, 'forty-thousand-demands.png') });
    let t = b.next('table');
    await b.act('view demands filter d3999');
    let v = await t;
    check('40,000-demand table: the filter keeps the 11 ids containing d3999', v && v.rows === 11 && v.first[0] === 'd3999',
          JSON.stringify(v));
    t = b.next('table');
    const sortStart = Date.now();
    await b.act('view demands sort 1 desc');  // column 1: the id (labels come first)
    v = await t;
    check('40,000-demand table: sorted by id, descending', v && v.first[0] === 'd39999' && v.rows === 11, JSON.stringify(v));
    t = b.next('table');
    await b.act('view demands filter ');
    v = await t;
    measurements.table_40000_sort_ms = Date.now() - sortStart;
    check('40,000-demand table: cleared filter, all rows sorted by id', v && v.rows === 40000 && v.first[0] === 'd9999',
          JSON.stringify(v));
    await b.close();
  }

  // 10e. More demands than the chart has pixels: the shares chart summarises, one bar per
  // pixel column, instead of one bar per demand.
  {
    const b = await browser();
    await b.page.goto(`${base}/apportion.html`);
    await b.next('solved');
    const opened = b.next('solved');
    await openFile(b, writeTmp('five-by-five.json', grid(5, 1, 9, 'Five by five', 5)));
    await opened;
    const solved = b.next('solved', 120000);
    await b.act('matrix uniform all 1 1 1 replace');
    const r = await solved;
    await b.act('tab 3');
    await b.page.waitForTimeout(400);
    const st = await b.state();
    check(`charts: ${r && r.shares.length} demands drawn as ${st.chart_bars} bars, one per pixel column`,
          r && r.status === 'optimal' && r.shares.length === 600 && st.chart_bars > 100 && st.chart_bars < 600,
          JSON.stringify([r && r.status, st.chart_bars]));
    await b.page.screenshot({ path: path.join(artefacts, 'chart-600-demands.png') });
    await b.close();
  }

  // 11. A broken share link shows an error and keeps the demo.
  {
    const b = await browser();
    const failedOpen = b.next('open-failed');
    await b.page.goto(`${base}/apportion.html#n=not-a-network`);
    const f = await failedOpen;
    check('broken share link: an error is shown, the demo stays', f && f.messages.length > 0 &&
          f.network === expected('harrowmere-fibre').network, JSON.stringify(f));
    await b.close();
  }

  // 12. Cancel stops a long solve, and the page keeps drawing while it runs.
  {
    const b = await browser(1);
    await b.page.goto(`${base}/apportion.html`);
    await b.next('solved');
    const progress = b.next('progress', 120000);
    const started = b.next('solve-started');
    await openFile(b, writeTmp('long-solve.json', grid(14, 220, 7, 'Long solve test grid')));
    await started;
    const frames = frameStats(b.page, 2000);
    const p = await progress;
    check('long solve: progress is reported', p !== null && p.solving === true, JSON.stringify(p));
    const fs1 = await frames;
    measurements.frames_while_solving = fs1;
    check(`long solve: the page keeps drawing (${fs1.fps.toFixed(0)} fps, longest frame gap ${fs1.longest.toFixed(0)} ms)`,
          fs1.fps >= 5 && fs1.longest < 500, JSON.stringify(fs1));
    const cancelled = b.next('cancelled');
    await b.act('cancel');
    const c = await cancelled;
    const late = b.next('solved', 3000);
    const l = await late;
    const st = await b.state();
    check('cancel stops the solve, the network stays', c && c.solving === false && l === null &&
          st.network === 'Long solve test grid' && st.status === 'not solved', JSON.stringify([c, l, st.status]));
    await b.page.screenshot({ path: path.join(artefacts, 'cancelled.png') });
    await b.close();
  }

  // 13. Hostile names: shown as text, exported harmlessly.
  {
    const b = await browser();
    await b.page.goto(`${base}/apportion.html`);
    await b.next('solved');
    const solved = b.next('solved');
    const o = await openFile(b, writeTmp('hostile.json', hostile()));
    check('hostile names: the network opens', o && o.network === '<b>hostile</b>', JSON.stringify(o));
    await solved;
    await b.page.waitForTimeout(300);
    const pwned = await b.page.evaluate(() => window.__pwned);
    const nodesInDom = await b.page.evaluate(() => document.querySelectorAll('script:not([type]), svg, img').length);
    check('hostile names: no script runs, no markup reaches the page', pwned === undefined && b.dialogs.length === 0,
          JSON.stringify([pwned, b.dialogs, nodesInDom]));
    const svgDl = b.page.waitForEvent('download');
    await b.act('export-svg');
    const svgDownload = await svgDl;
    const svg = fs.readFileSync(await svgDownload.path(), 'utf8');
    check('hostile names: the SVG escapes them', !svg.includes('<script') && !svg.includes('<img') &&
          svg.includes('&lt;script&gt;') && !/[\u0000-\u0008\u000b\u001b]/.test(svg));
    const csvDl = b.page.waitForEvent('download');
    await b.act('export-arcs-csv');
    const csv = fs.readFileSync(await (await csvDl).path(), 'utf8');
    check('hostile names: the CSV neutralises formulas', csv.includes("'+cmd|calc") && csv.includes("'-2+3") &&
          !/(^|,)[=+@-][^,]*/m.test(csv.replace(/(^|,)-?[0-9.e+-]+(?=,|$)/gm, '$1')), csv);
    const demandsDl = b.page.waitForEvent('download');
    await b.act('export-demands-csv');
    const dcsv = fs.readFileSync(await (await demandsDl).path(), 'utf8');
    check('hostile names: demand ids and labels in CSV are neutralised', dcsv.includes("'=1+2"), dcsv);
    await b.page.screenshot({ path: path.join(artefacts, 'hostile-names.png') });
    await b.close();
  }

  // 14. Frame rate animating a generated network of 5,000 arcs (measured, reported).
  {
    const b = await browser(1);
    await b.page.goto(`${base}/apportion.html`);
    await b.next('solved');
    const solved = b.next('solved', 300000);
    await openFile(b, writeTmp('five-thousand-arcs.json', grid(36, 12, 11, 'Frame rate test grid', 6)));
    const s = await solved;
    const st = await b.state();
    check('5,000-arc network: opened and solved', s && s.status === 'optimal' && st.arcs >= 5000, JSON.stringify([st.arcs, s && s.status]));
    const fr = await frameStats(b.page, 3000);
    const pos = await b.positions();
    measurements.animation_5000_arcs = { arcs: st.arcs, ...fr, canvas_build_ms: pos.canvas_ms };
    console.log(`      5,000 arcs: ${fr.fps.toFixed(1)} fps (median frame ${fr.median.toFixed(1)} ms, canvas built in ${pos.canvas_ms.toFixed(1)} ms)`);
    check('5,000-arc network: the page animates it', fr.fps > 0, JSON.stringify(fr));
    await b.page.screenshot({ path: path.join(artefacts, 'five-thousand-arcs.png') });
    await b.close();
  }

  // 16. Readable at a meeting: the toolbar at 1,024 px, labels before fields, the light theme
  // and the text size (remembered), a resizable side panel, the view refitting, charts with
  // axes, the canvas PNG alone, the SVG for a report; screenshots at DPR 1 and 2, light and dark.
  {
    const b = await browser(1);
    await b.page.setViewportSize({ width: 1024, height: 768 });
    const solved = b.next('solved');
    await b.page.goto(`${base}/apportion.html`);
    await solved;
    await b.page.waitForTimeout(300);
    let st = await b.state();
    const bar = new Map(st.toolbar.map(([name, x0, y0, x1, y1]) => [name, { x0, y0, x1, y1 }]));
    const right = Math.max(...st.toolbar.map((t) => t[3]));
    const rows = new Set(st.toolbar.map((t) => Math.round(t[2]))).size;
    check('1,024 px: every toolbar item is inside the window (the toolbar wraps)', right <= st.window[0] && rows >= 2,
          `right edge ${right} of ${st.window[0]}, ${rows} rows`);
    const label = bar.get('label:rule'), rule = bar.get('rule');
    check('toolbar: the label "Rule" comes before its field, on its row', label && rule && label.x1 <= rule.x0 &&
          Math.abs((label.y0 + label.y1) / 2 - (rule.y0 + rule.y1) / 2) < 4, JSON.stringify([label, rule]));
    const hops = bar.get('label:hops'), hopsField = bar.get('hops');
    check('toolbar: "Hop limit" before its field', hops && hopsField && hops.x1 <= hopsField.x0);
    check('DPR 1: the font is rasterised at 15 px (DejaVu Sans, 100 %)', st.font_px === 15, String(st.font_px));
    check('dark theme by default', st.theme === 'dark');
    // Every column of the shares table sorts. By hand from the demo's result (shares 40, 30,
    // 30, 50; tiers 3, 2, 1, 4) and its labels; ties keep the file's order.
    const sorted = async (column, direction) => {
      const t = b.next('table');
      await b.act(`view shares sort ${column} ${direction}`);
      return (await t).first;
    };
    const byShare = await sorted(1, 'desc'), byLabel = await sorted(0, 'asc'), byTier = await sorted(3, 'asc');
    const byEnds = await sorted(5, 'desc');
    await sorted(0, 'none');
    check('shares table sorts by share, by label, by tier and by its ends',
          JSON.stringify(byShare) === JSON.stringify(['d-west', 'd-north', 'd-east', 'd-south']) &&
          JSON.stringify(byLabel) === JSON.stringify(['d-north', 'd-south', 'd-east', 'd-west']) &&
          JSON.stringify(byTier) === JSON.stringify(['d-south', 'd-east', 'd-north', 'd-west']) &&
          JSON.stringify(byEnds) === JSON.stringify(['d-west', 'd-east', 'd-south', 'd-north']),
          JSON.stringify([byShare, byLabel, byTier, byEnds]));
    await b.page.screenshot({ path: path.join(artefacts, 'display-dark-dpr1.png') });
    const darkShot = readPng(await b.page.screenshot());
    let pos = await b.positions();
    const [cx, cy, cw, ch] = pos.canvas;
    const darkLuma = darkShot.luma(cx + cw - 60, cy + 10, cx + cw - 10, cy + 60);

    // Light theme and 130 % text: applied at once, and remembered after a reload.
    await b.act('theme light');
    await b.act('text-size 130');
    await b.page.waitForTimeout(300);
    st = await b.state();
    check('light theme and 130 % text applied', st.theme === 'light' && st.text_size === 130 &&
          st.font_px === Math.round(15 * 1.3), JSON.stringify([st.theme, st.text_size, st.font_px]));
    pos = await b.positions();
    const lightShot = readPng(await b.page.screenshot());
    const [lx, ly, lw, lh] = pos.canvas;
    const lightLuma = lightShot.luma(lx + lw - 60, ly + 10, lx + lw - 10, ly + 60);
    check('light theme: the canvas background is light, the dark one dark (screenshot pixels)',
          lightLuma > 0.9 && darkLuma < 0.2, `light ${lightLuma.toFixed(3)}, dark ${darkLuma.toFixed(3)}`);
    await b.page.screenshot({ path: path.join(artefacts, 'display-light-130-dpr1.png') });
    // Labels: inside the canvas, never over each other, and most nodes keep theirs.
    const boxes = pos.labels.map(([, x0, y0, x1, y1]) => ({ x0, y0, x1, y1 }));
    const overlap = (p, q) => p.x0 < q.x1 - 0.5 && q.x0 < p.x1 - 0.5 && p.y0 < q.y1 - 0.5 && q.y0 < p.y1 - 0.5;
    check('130 %: node labels inside the canvas, none over another, at least 8 of 9 shown',
          pos.labels.length >= 8 && boxes.every((q) => q.x0 >= lx && q.y0 >= ly && q.x1 <= lx + lw && q.y1 <= ly + lh) &&
          boxes.every((p, i) => boxes.every((q, j) => i === j || !overlap(p, q))),
          JSON.stringify(pos.labels.map((l) => l[0])));
    const wrappedRows = new Set(st.toolbar.map((t) => Math.round(t[2]))).size;
    check('130 % at 1,024 px: still no toolbar item outside the window',
          Math.max(...st.toolbar.map((t) => t[3])) <= st.window[0], `${wrappedRows} rows`);

    // The side panel's edge drags; the canvas refits into the room it leaves.
    const [sx0, sy0, sx1, sy1] = st.splitter;
    const before = st.side_width;
    await b.page.mouse.move((sx0 + sx1) / 2, (sy0 + sy1) / 2);
    await b.page.mouse.down();
    await b.page.mouse.move((sx0 + sx1) / 2 - 80, (sy0 + sy1) / 2, { steps: 8 });
    await b.page.mouse.up();
    await b.page.waitForTimeout(200);
    st = await b.state();
    check('dragging the side panel\'s edge makes it narrower', Math.abs(st.side_width - (before - 80)) < 6,
          `${before} -> ${st.side_width}`);
    const inside = (p) => {
      const [x, y, w, h] = p.canvas;
      return Object.values(p.nodes).every(([nx, ny]) => nx >= x && nx <= x + w && ny >= y && ny <= y + h);
    };
    await b.page.setViewportSize({ width: 1366, height: 800 });
    await b.page.waitForTimeout(400);
    pos = await b.positions();
    const xs = Object.values(pos.nodes).map((n) => n[0]);
    check('the view refits on a window resize: every node inside the canvas, spread over it',
          inside(pos) && Math.max(...xs) - Math.min(...xs) > 0.4 * pos.canvas[2], JSON.stringify(pos.canvas));

    // Charts: axes with tick labels up to the largest share and to 100 %.
    await b.act('tab 3');
    await b.page.waitForTimeout(300);
    st = await b.state();
    check('charts: both have a y axis with tick labels (utilisation up to "100 %")',
          st.chart_ticks.length === 2 && st.chart_ticks[1] === '100 %' && Number(st.chart_ticks[0]) > 0,
          JSON.stringify(st.chart_ticks));
    await b.page.screenshot({ path: path.join(artefacts, 'display-charts-light.png') });

    // The PNG is the canvas alone: its size is the canvas's, not the page's.
    pos = await b.positions();
    const pngDl = b.page.waitForEvent('download');
    await b.act('export-png');
    const png = await pngDl;
    const pngFile = path.join(tmp, 'canvas.png');
    await png.saveAs(pngFile);
    const shot = readPng(fs.readFileSync(pngFile));
    check('PNG export: the canvas alone, at its size on screen', png.suggestedFilename() === 'Harrowmere-Province-regional-fibre-backbone.canvas.png' &&
          Math.abs(shot.width - pos.canvas[2]) <= 2 && Math.abs(shot.height - pos.canvas[3]) <= 2,
          `${png.suggestedFilename()} ${shot.width}x${shot.height} against ${pos.canvas[2]}x${pos.canvas[3]}`);
    check('PNG export: drawn in the light theme as on screen', shot.luma(shot.width - 50, 5, shot.width - 5, 50) > 0.9);

    // The SVG for a report: light, with the rule, the totals, the date, arrows and the caution.
    const svgDl = b.page.waitForEvent('download');
    await b.act('export-svg');
    const svgFile = path.join(tmp, 'picture.svg');
    await (await svgDl).saveAs(svgFile);
    const svg = fs.readFileSync(svgFile, 'utf8');
    check('SVG export: light, titled, with rule, totals, date, arrows, legend and caution',
          svg.includes('fill="#ffffff"') && svg.includes('Rule: Max-min fair shares (weighted)') &&
          /throughput [0-9.]+/.test(svg) && /made 20[0-9]{2}-[0-9]{2}-[0-9]{2} [0-9]{2}:[0-9]{2}/.test(svg) &&
          svg.includes('<polygon') && svg.includes('arc utilisation') && svg.includes('planning aid'));

    // Each rule explains a 0, and names arcs as the canvas does; feasibility draws its cut.
    const ids = expected('harrowmere-fibre').demands.map((d) => d.id);
    const iNorth = ids.indexOf('d-north'), iEast = ids.indexOf('d-east');
    check('"Bound by" names arcs by their ends (labels), not by ids', st.bound_by[iEast].includes('\u2192') &&
          !/l[0-9]+-ab/.test(st.bound_by[iEast]), JSON.stringify(st.bound_by[iEast]));
    let ruled = b.next('solved');
    await b.act('objective 1');
    ruled = await ruled;
    check('max concurrent flow: the demand without an amount gets 0, and the table says why',
          ruled && ruled.shares[iNorth] === 0 && ruled.bound_by[iNorth].startsWith('0: it asks for as much as possible'),
          JSON.stringify(ruled && ruled.bound_by[iNorth]));
    ruled = b.next('solved');
    await b.act('objective 4');
    ruled = await ruled;
    await b.page.waitForTimeout(300);
    pos = await b.positions();
    // By hand from the demo (and the command line's "overloaded cut"): the origin side
    // {HRW, CAL, DUN, ELS, FEN, IVB, LAN} leaves by IVB->KES, DUN->KES and FEN->GRY.
    check('feasibility: the overloaded cut is drawn (its 3 arcs outlined)', pos.cut_arcs === 3, String(pos.cut_arcs));
    await b.page.screenshot({ path: path.join(artefacts, 'feasibility-cut-light.png') });
    ruled = b.next('solved');
    await b.act('objective 0');
    await ruled;

    // Remembered: a reload keeps the theme, the text size and the panel's width.
    const width = st.side_width;
    const again = b.next('first-frame');
    await b.page.reload();
    await again;
    await b.page.waitForTimeout(300);
    st = await b.state();
    check('a reload keeps the theme, the text size and the side panel\'s width',
          st.theme === 'light' && st.text_size === 130 && Math.abs(st.side_width - width) < 1,
          JSON.stringify([st.theme, st.text_size, st.side_width]));
    check('display: a clean console', b.problems.length === 0, JSON.stringify(b.problems));
    await b.close();

    // DPR 2, dark and light: the font at twice the pixels, for the reviewer's screenshots.
    const b2 = await browser(2);
    const solved2 = b2.next('solved');
    await b2.page.goto(`${base}/apportion.html`);
    await solved2;
    await b2.page.waitForTimeout(300);
    st = await b2.state();
    check('DPR 2: the font is rasterised at 30 px', st.font_px === 30, String(st.font_px));
    await b2.page.screenshot({ path: path.join(artefacts, 'display-dark-dpr2.png') });
    await b2.act('theme light');
    await b2.page.waitForTimeout(300);
    await b2.page.screenshot({ path: path.join(artefacts, 'display-light-dpr2.png') });
    await b2.close();
  }

  // 15. The single file from file://.
  {
    const b = await browser();
    const first = b.next('first-frame');
    const solved = b.next('solved');
    const started = Date.now();
    await b.page.goto('file://' + path.join(webDir, 'apportion-single.html'));
    const s = await first;
    check('single file: first frame drawn from file://', s !== null);
    measurements.first_frame_single_file_ms = Date.now() - started;
    console.log(`      single file: first frame after ${measurements.first_frame_single_file_ms} ms`);
    const r = await solved;
    check('single file: demo shares (worker from a Blob URL) equal the command line\'s',
          r && sameShares(r.shares, harrowmere), JSON.stringify(r));
    await b.page.mouse.move(900, 450);
    await b.page.mouse.wheel(0, -240);
    await b.page.waitForTimeout(300);
    check('single file: a clean console after load, solve and zoom (no error, warning or failed load)',
          b.problems.length === 0, JSON.stringify(b.problems));
    await b.page.screenshot({ path: path.join(artefacts, 'single-file.png') });
    const foreign = b.requests.filter((u) => !u.startsWith('file://') && !u.startsWith('data:') && !u.startsWith('blob:'));
    check('single file: no request leaves the machine', foreign.length === 0, foreign.join(' '));
    // The policy is enforced, not just written: a request to another machine is refused.
    const blocked = await b.page.evaluate(() => new Promise((done) => {
      document.addEventListener('securitypolicyviolation', (e) => done(e.violatedDirective), { once: true });
      fetch('http://192.0.2.1/x').catch(() => {});
      setTimeout(() => done(null), 2000);
    }));
    check('single file: the policy refuses outside connections', blocked === 'connect-src', String(blocked));
    // A share link from a page opened as a file points into this computer: the page says how
    // to share instead (copied or not: the clipboard may be refused to file:// pages).
    const answered = Promise.race([b.next('share-copied'), b.next('share-not-copied')]);
    await b.act('share-link');
    const sa = await answered;
    check('single file: a share link says how to share from a page opened as a file',
          sa && sa.notice.includes('opened as a file') && sa.notice.includes('Save network'), JSON.stringify(sa && sa.notice));
    measurements.single_file_bytes = fs.statSync(path.join(webDir, 'apportion-single.html')).size;
    check('single file: under 3 MB, the font included', measurements.single_file_bytes < 3 * 1024 * 1024,
          String(measurements.single_file_bytes));
    await b.close();
  }
} finally {
  server.close();
  fs.writeFileSync(path.join(artefacts, 'measurements.json'), JSON.stringify(measurements, null, 2) + '\n');
  fs.rmSync(tmp, { recursive: true, force: true });
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed ? 1 : 0);
