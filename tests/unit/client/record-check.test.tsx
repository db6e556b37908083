// A capture form's check: messages from the shared schema at their fields, drawn once at mount.
// @vitest-environment happy-dom
import { act } from 'react';
import { createRoot } from 'react-dom/client';
import { describe, expect, it } from 'vitest';
import { FieldIssue, useRecordCheck } from '@/app/(field)/field/_components/record-check';
import type { EntityFields } from '@/lib/shared/schemas/sync';

(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

const flow = (trial: { volumeL: number; seconds: number }) =>
  ({
    visitId: '11111111-1111-4111-8111-111111111111',
    sourceId: null,
    takenAt: '2026-12-01T10:00:00.000Z',
    notes: '',
    measurement: { method: 'volumetric', season: 'dry', trials: [trial] },
  }) as EntityFields<'flowMeasurement'>;

let renders = 0;
let saved: Promise<boolean> | null = null;

function Form({ record }: { record: EntityFields<'flowMeasurement'> }) {
  renders++;
  const { check, save } = useRecordCheck('flowMeasurement', 'metric');
  return (
    <div>
      <FieldIssue check={check} path="measurement.trials.0.volumeL" />
      <FieldIssue check={check} path="measurement.trials.0.seconds" />
      <p data-testid="unplaced">{check.unplaced(['measurement.trials']).join(' | ')}</p>
      <button type="button" onClick={() => (saved = save('22222222-2222-4222-8222-222222222222', record))}>
        Save
      </button>
    </div>
  );
}

async function mount(record: EntityFields<'flowMeasurement'>) {
  const host = document.createElement('div');
  document.body.append(host);
  const root = createRoot(host);
  renders = 0;
  await act(async () => root.render(<Form record={record} />));
  return { host, root };
}

describe('the capture forms’ record check', () => {
  it('draws the form once when it mounts (no second pass from a form library’s own state)', async () => {
    const { root } = await mount(flow({ volumeL: 20, seconds: 4 }));
    expect(renders).toBe(1);
    await act(async () => root.unmount());
  });

  it('puts each refused reading’s message at its own field, in plain words, and saves nothing', async () => {
    const { host, root } = await mount(flow({ volumeL: -20, seconds: 0 }));
    await act(async () => {
      host.querySelector('button')!.click();
      expect(await saved).toBe(false);
    });
    const volume = host.querySelector('[data-field-issue="measurement.trials.0.volumeL"]');
    const seconds = host.querySelector('[data-field-issue="measurement.trials.0.seconds"]');
    expect(volume?.textContent).toMatch(/bucket|volume/i);
    expect(seconds?.textContent).toMatch(/\w/);
    for (const text of [volume?.textContent, seconds?.textContent]) expect(text).not.toMatch(/too_small|expected|measurement\./i);
    // Both messages have a field, so none is left for the form to list above its save button.
    expect(host.querySelector('[data-testid="unplaced"]')?.textContent).toBe('');
    await act(async () => root.unmount());
  });
});
