// The local fake map tile server: draws 256 px PNG tiles of an invented landscape (land, contour
// bands, creeks, a tile grid with each tile's z/x/y written small) for any {z}/{x}/{y}, the same
// bytes every time. `npm start` and `npm test` use it when NEXT_PUBLIC_TILE_URL is not set, so the
// field map has a background (and something to keep offline) without any outside service.
import { createServer } from 'node:http';
import pngjs from 'pngjs';

const { PNG } = pngjs;
const SIZE = 256;
const MAX_ZOOM = 20;
/** Rendered tiles kept in memory (a phone's offline set is a few thousand at most). */
const MEMORY_TILES = 4000;

// Ground units: about a kilometre at the demo district's latitude (52° N), so the invented hills
// and creeks have the same size on the ground at every zoom and run on across tile edges.
const KM_PER_WORLD = 40_075 * Math.cos((52 * Math.PI) / 180);

/** An invented height (m) at ground position (u, v) in km: a few long swells and a ridge. */
function height(u, v) {
  return (
    260 +
    70 * Math.sin(0.55 * u + 0.25 * v) +
    45 * Math.sin(0.42 * v - 0.61 * u + 1.3) +
    18 * Math.sin(1.7 * u + 0.4) * Math.cos(1.3 * v - 0.2) +
    6 * Math.sin(4.1 * u - 3.3 * v)
  );
}

/** A creek runs where this is near zero: meandering lines roughly north–south, a couple of km apart. */
function creek(u, v) {
  return Math.sin(1.4 * u + 0.9 * Math.sin(0.8 * v) + 0.35 * Math.sin(2.3 * v + 1.1));
}

/** Field edges: slightly wavy lines on a ~300 m grid, one pixel wide (or ~3 m on the ground). */
function hedge(u, v, kmPerPixel) {
  const half = Math.max(kmPerPixel, 0.003) / 2;
  const a = (u + 0.02 * Math.sin(v * 7)) / 0.3;
  const b = (v + 0.02 * Math.sin(u * 5)) / 0.32;
  return Math.abs(a - Math.round(a)) * 0.3 < half || Math.abs(b - Math.round(b)) * 0.32 < half;
}

// 3×5 pixel digits and the slash, for the tile's own address in its corner.
const GLYPHS = {
  0: ['111', '101', '101', '101', '111'],
  1: ['010', '110', '010', '010', '111'],
  2: ['111', '001', '111', '100', '111'],
  3: ['111', '001', '111', '001', '111'],
  4: ['101', '101', '111', '001', '001'],
  5: ['111', '100', '111', '001', '111'],
  6: ['111', '100', '111', '101', '111'],
  7: ['111', '001', '010', '010', '010'],
  8: ['111', '101', '111', '101', '111'],
  9: ['111', '101', '111', '001', '111'],
  '/': ['001', '001', '010', '100', '100'],
};

const LAND = [
  [226, 232, 205],
  [214, 224, 192],
];
const CONTOUR = [168, 150, 112];
const WATER = [74, 132, 176];
const GRID = [190, 196, 178];
const HEDGE = [150, 170, 120];
const INK = [70, 72, 66];
const LABEL = [244, 244, 234];

function put(data, px, py, [r, g, b]) {
  const i = (py * SIZE + px) * 4;
  data[i] = r;
  data[i + 1] = g;
  data[i + 2] = b;
  data[i + 3] = 255;
}

function writeText(data, text, left, top, scale = 2) {
  // A pale label behind the figures, so they read over a creek or a contour.
  for (let py = top - 2; py < top + 5 * scale + 2; py++) for (let px = left - 2; px < left + text.length * 4 * scale + 1; px++) put(data, px, py, LABEL);
  let x = left;
  for (const ch of text) {
    const glyph = GLYPHS[ch];
    if (glyph) {
      glyph.forEach((row, gy) =>
        [...row].forEach((on, gx) => {
          if (on !== '1') return;
          for (let sy = 0; sy < scale; sy++) for (let sx = 0; sx < scale; sx++) put(data, x + gx * scale + sx, top + gy * scale + sy, INK);
        }),
      );
    }
    x += 4 * scale;
  }
}

/** The PNG bytes of tile z/x/y: deterministic, 256 × 256, RGBA. */
export function renderTile(z, x, y) {
  const png = new PNG({ width: SIZE, height: SIZE });
  const n = 2 ** z;
  const kmPerPixel = KM_PER_WORLD / (n * SIZE);
  // Contours every 2 to 50 m, so there are a few bands on a tile at any zoom.
  const step = z >= 17 ? 2 : z >= 16 ? 5 : z >= 15 ? 10 : z >= 13 ? 20 : 50;
  // Hedges (field edges about 300 m apart) once a field is more than a few pixels across.
  const hedges = z >= 14;
  // Creeks at least ~2 px wide, wider on the ground when zoomed right in.
  const creekHalfWidth = Math.max(1.2 * kmPerPixel, 0.004) * 1.4;
  for (let py = 0; py < SIZE; py++) {
    for (let px = 0; px < SIZE; px++) {
      const u = ((x * SIZE + px) / (n * SIZE)) * KM_PER_WORLD;
      const v = ((y * SIZE + py) / (n * SIZE)) * KM_PER_WORLD;
      const band = Math.floor(height(u, v) / step);
      let colour = LAND[band & 1];
      if (band !== Math.floor(height(u + kmPerPixel, v) / step) || band !== Math.floor(height(u, v + kmPerPixel) / step)) colour = CONTOUR;
      if (hedges && hedge(u, v, kmPerPixel)) colour = HEDGE;
      if (Math.abs(creek(u, v)) < creekHalfWidth) colour = WATER;
      if (px === 0 || py === 0) colour = GRID;
      put(png.data, px, py, colour);
    }
  }
  writeText(png.data, `${z}/${x}/${y}`, 4, 4);
  return PNG.sync.write(png, { colorType: 2 });
}

/** z/x/y from a request path `/z/x/y.png`, or null when it is not a tile of the world. */
export function parseTilePath(pathname) {
  const m = /^\/(\d{1,2})\/(\d{1,7})\/(\d{1,7})\.png$/.exec(pathname);
  if (!m) return null;
  const [z, x, y] = m.slice(1).map(Number);
  if (z > MAX_ZOOM || x >= 2 ** z || y >= 2 ** z) return null;
  return { z, x, y };
}

/** The tile template of a fake server on this port. */
export const fakeTileTemplate = (port) => `http://127.0.0.1:${port}/{z}/{x}/{y}.png`;

/** Starts the fake on 127.0.0.1:port (0 picks one); resolves to { port, close }. Throws EADDRINUSE if taken. */
export async function startFakeTiles({ port }) {
  const memory = new Map();
  const server = createServer((req, res) => {
    // Any page may draw the tiles and the phone's worker may keep them: CORS open, like public tile hosts.
    res.setHeader('access-control-allow-origin', '*');
    const tile = req.method === 'GET' || req.method === 'HEAD' ? parseTilePath(new URL(req.url ?? '/', 'http://x').pathname) : null;
    if (!tile) {
      res.writeHead(404, { 'content-type': 'text/plain' }).end('Not a tile: ask for /{z}/{x}/{y}.png\n');
      return;
    }
    const key = `${tile.z}/${tile.x}/${tile.y}`;
    let body = memory.get(key);
    if (!body) {
      body = renderTile(tile.z, tile.x, tile.y);
      if (memory.size >= MEMORY_TILES) memory.delete(memory.keys().next().value);
      memory.set(key, body);
    }
    res.writeHead(200, { 'content-type': 'image/png', 'content-length': body.length, 'cache-control': 'public, max-age=86400' });
    res.end(req.method === 'HEAD' ? undefined : body);
  });
  await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', resolve);
  });
  return {
    port: server.address().port,
    close: () =>
      new Promise((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
