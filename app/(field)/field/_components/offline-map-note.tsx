'use client';

import { useEffect, useState } from 'react';
import { onOfflineTilesChange, readOfflineTiles, TILE_TEMPLATE, type OfflineTiles } from '@/lib/client/offline-tiles';
import { formatBytes } from '@/lib/shared/display/numbers';
import { OFFLINE_TILE_CAP } from '@/lib/shared/map-tiles';

/** The offline map summary the last tile run wrote; undefined while it is read. */
function useOfflineTiles(): OfflineTiles | null | undefined {
  const [tiles, setTiles] = useState<OfflineTiles | null | undefined>(undefined);
  useEffect(() => {
    let live = true;
    const read = () =>
      void readOfflineTiles().then(
        (m) => {
          if (live) setTiles(m);
        },
        () => {
          if (live) setTiles(null);
        },
      );
    read();
    const stop = onOfflineTilesChange(read);
    return () => {
      live = false;
      stop();
    };
  }, []);
  return tiles;
}

/** "Map for offline: 180 tiles, 2.1 MB": how much of this visit's map the phone keeps for no signal. */
export function OfflineMapNote({ visitId }: { visitId: string }) {
  const tiles = useOfflineTiles();
  if (!TILE_TEMPLATE) return null;
  const visit = tiles?.visits[visitId];
  let text: string;
  if (tiles === undefined) text = '\u00a0';
  else if (!visit) text = 'Map for offline: kept on this phone after the next sync with a signal.';
  else if (visit.planned === 0) text = 'Map for offline: none yet, as neither the farm nor any point has a position.';
  else if (visit.kept >= visit.planned) text = `Map for offline: ${visit.kept} tiles, ${formatBytes(visit.bytes)}.`;
  else text = `Map for offline: ${visit.kept} of ${visit.planned} tiles so far (${formatBytes(visit.bytes)}); the rest come with a signal.`;
  return (
    <p className="text-stone" data-testid="offline-map">
      {text}
      {visit && !visit.complete && ` Some close-up tiles are left out: the phone keeps at most ${OFFLINE_TILE_CAP} map tiles for all its visits.`}
    </p>
  );
}
