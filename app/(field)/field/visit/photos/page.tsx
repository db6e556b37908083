'use client';

import { useFieldQuery } from '../../_components/use-field-query';
import { Suspense, useEffect, useMemo, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { fieldDb } from '@/lib/client/db';
import { newId } from '@/lib/client/ids';
import { savePhoto } from '@/lib/client/outbox';
import { waitingPhotoIds } from '@/lib/client/photo-queue';
import { readPhoto } from '@/lib/client/photo-intake';
import { announceSave } from '@/lib/client/sync/triggers';
import { SectionHeader } from '../../_components/choice';
import { useVisitId } from '../../_components/use-field-data';
import { useUndoableDelete } from '../../_components/undo-delete';

/** A photo shown from the phone's own bytes, or the server's thumbnail when it came from elsewhere. */
function Thumb({ id, alt }: { id: string; alt: string }) {
  const blob = useFieldQuery(() => fieldDb().photoBlobs.get(id), [id]);
  const url = useMemo(() => (blob ? URL.createObjectURL(new Blob([blob.data], { type: blob.mime })) : null), [blob]);
  useEffect(
    () => () => {
      if (url) URL.revokeObjectURL(url);
    },
    [url],
  );
  const src = url ?? (blob === undefined ? null : `/api/photos/${id}/thumbnail`);
  return src ? (
    // eslint-disable-next-line @next/next/no-img-element -- object URLs of local bytes; next/image cannot optimise them
    <img src={src} alt={alt} className="h-28 w-28 rounded-md border border-rule object-cover" />
  ) : (
    <span className="block h-28 w-28 rounded-md bg-rule" />
  );
}

function PhotosPage() {
  const visitId = useVisitId();
  const { remove, bar } = useUndoableDelete();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const photos = useFieldQuery(async () => {
    const db = fieldDb();
    const rows = (await db.photos.where('visitId').equals(visitId).toArray()).filter((p) => !p.deletedAt);
    // Waiting means the bytes have not gone up, whether or not the metadata has (a refused photo's
    // metadata is on the server, its bytes are not). Read by keys: no photo's bytes are loaded here.
    const waiting = new Set(await waitingPhotoIds(db));
    return rows.map((p) => ({ ...p, uploaded: !waiting.has(p.id) }));
  }, [visitId]);

  async function add(list: FileList | null) {
    // Copy first: clearing the input empties the live FileList.
    const files = Array.from(list ?? []);
    if (!files.length) return;
    setBusy(true);
    const problems: string[] = [];
    for (const file of files) {
      try {
        const { data, fields } = await readPhoto(file);
        await savePhoto(newId(), { ...fields, visitId, pointId: null, caption: file.name.slice(0, 300) }, data);
      } catch (error) {
        problems.push(error instanceof Error ? error.message : `${file.name} could not be read.`);
      }
    }
    setBusy(false);
    setMessage(problems.length ? problems.join(' ') : `${files.length} photo${files.length === 1 ? '' : 's'} kept on this phone.`);
    announceSave();
  }

  return (
    <div className="space-y-5">
      <SectionHeader visitId={visitId} title="Photos" />
      <label className="flex min-h-16 w-full cursor-pointer items-center justify-center rounded-md bg-slate text-xl font-bold text-white">
        {busy ? 'Reading…' : 'Take or choose photos'}
        <input
          type="file"
          accept="image/jpeg,image/png,image/webp"
          capture="environment"
          multiple
          className="sr-only"
          onChange={(e) => {
            void add(e.target.files);
            e.target.value = '';
          }}
          data-testid="photo-input"
        />
      </label>
      {message && (
        <p role="status" className="font-bold">
          {message}
        </p>
      )}
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        {photos?.map((p) => (
          <Card as="li" padding="sm" key={p.id}>
            <Thumb id={p.id} alt={p.caption || 'Site photo'} />
            <span className="mt-1 block text-sm">{p.lat !== null ? `${p.lat.toFixed(5)}, ${p.lon?.toFixed(5)}` : 'No position'}</span>
            <span className="block text-sm font-bold">{p.uploaded ? 'On the server' : 'Waiting to upload'}</span>
            <Button variant="quiet" size="wide" className="mt-1" onClick={() => remove('photo', p.id, 'the photo')}>
              Delete
            </Button>
          </Card>
        ))}
      </ul>
      {bar}
    </div>
  );
}

export default function Page() {
  return (
    <Suspense>
      <PhotosPage />
    </Suspense>
  );
}
