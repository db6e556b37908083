// Types for fake-tiles.mjs (plain JS: the bootstrap scripts run it without a build step).
export interface TileAddress {
  z: number;
  x: number;
  y: number;
}
/** The PNG bytes of tile z/x/y: deterministic, 256 × 256. */
export function renderTile(z: number, x: number, y: number): Buffer;
/** z/x/y from a request path `/z/x/y.png`, or null when it is not a tile of the world. */
export function parseTilePath(pathname: string): TileAddress | null;
/** The tile template of a fake server on this port. */
export function fakeTileTemplate(port: number | string): string;
/** Starts the fake on 127.0.0.1:port (0 picks one). */
export function startFakeTiles(options: { port: number }): Promise<{ port: number; close(): Promise<void> }>;
