import { PNG } from 'pngjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fakeTileTemplate, parseTilePath, renderTile, startFakeTiles } from '@/scripts/lib/fake-tiles.mjs';

const pixel = (png: PNG, x: number, y: number) => [...png.data.subarray((y * png.width + x) * 4, (y * png.width + x) * 4 + 4)];

describe("the fake tile server's drawing", () => {
  it('is a valid 256 px PNG', () => {
    const bytes = renderTile(15, 16055, 10843);
    expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const png = PNG.sync.read(bytes);
    expect([png.width, png.height]).toEqual([256, 256]);
    // Opaque everywhere: a map background, not an overlay.
    for (let i = 3; i < png.data.length; i += 4) if (png.data[i] !== 255) throw new Error(`transparent byte at ${i}`);
  });

  it('draws the same bytes for the same tile and different ones for a neighbour', () => {
    const a = renderTile(14, 8027, 5421);
    expect(renderTile(14, 8027, 5421).equals(a)).toBe(true);
    expect(renderTile(14, 8028, 5421).equals(a)).toBe(false);
  });

  it('has more than one colour: land bands, lines and the written address', () => {
    const png = PNG.sync.read(renderTile(12, 2006, 1355));
    const colours = new Set<string>();
    for (let y = 0; y < 256; y += 3) for (let x = 0; x < 256; x += 3) colours.add(pixel(png, x, y).join(','));
    expect(colours.size).toBeGreaterThanOrEqual(4);
    // The grid line along the tile's top edge differs from the land just inside it.
    expect(pixel(png, 128, 0)).not.toEqual(pixel(png, 128, 30));
  });

  it('knows a tile path from anything else', () => {
    expect(parseTilePath('/17/64223/43373.png')).toEqual({ z: 17, x: 64223, y: 43373 });
    expect(parseTilePath('/2/4/0.png')).toBeNull();
    expect(parseTilePath('/21/0/0.png')).toBeNull();
    expect(parseTilePath('/a/b/c.png')).toBeNull();
    expect(parseTilePath('/../etc/passwd')).toBeNull();
  });
});

describe('the fake tile server', () => {
  let server: Awaited<ReturnType<typeof startFakeTiles>>;
  beforeAll(async () => {
    server = await startFakeTiles({ port: 0 });
  });
  afterAll(() => server.close());

  it('serves PNG tiles on loopback with CORS open, and 404 for other paths', async () => {
    const url = fakeTileTemplate(server.port).replace('{z}', '13').replace('{x}', '4013').replace('{y}', '2710');
    expect(url).toBe(`http://127.0.0.1:${server.port}/13/4013/2710.png`);
    const res = await fetch(url);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/png');
    expect(res.headers.get('access-control-allow-origin')).toBe('*');
    expect(Buffer.from(await res.arrayBuffer()).equals(renderTile(13, 4013, 2710))).toBe(true);
    expect((await fetch(`http://127.0.0.1:${server.port}/13/99999/2710.png`)).status).toBe(404);
    expect((await fetch(`http://127.0.0.1:${server.port}/`)).status).toBe(404);
  });
});
