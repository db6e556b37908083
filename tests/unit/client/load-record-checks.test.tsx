// The capture forms' checks (the shared schemas) load on first use, not while the screen first renders.
// @vitest-environment happy-dom
import { act } from 'react';
import { createRoot } from 'react-dom/client';
import { describe, expect, it, vi } from 'vitest';
import { loadedRecordChecks, loadRecordChecks, useRecordChecksOnFirstUse } from '@/lib/client/load-record-checks';

function Form() {
  useRecordChecksOnFirstUse();
  return <input aria-label="Bucket volume" />;
}

(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

describe('loading the record checks', () => {
  it('renders a form without them, starts loading them at the first touch, and loads them once', async () => {
    const host = document.createElement('div');
    document.body.append(host);
    const root = createRoot(host);
    await act(async () => root.render(<Form />));
    expect(loadedRecordChecks()).toBeNull();

    await act(async () => {
      host.querySelector('input')!.dispatchEvent(new Event('pointerdown', { bubbles: true }));
    });
    // Loading by the touch alone: nothing here asks for the checks.
    await vi.waitFor(() => expect(loadedRecordChecks()).not.toBeNull(), { timeout: 5000 });
    expect(await loadRecordChecks()).toBe(loadedRecordChecks());
    await act(async () => root.unmount());
  });

  it('checks with the shared schema: an impossible reading is refused with a plain message at its field', async () => {
    const { checkRecord } = await loadRecordChecks();
    const refused = checkRecord(
      'flowMeasurement',
      {
        visitId: '11111111-1111-4111-8111-111111111111',
        sourceId: null,
        takenAt: '2026-12-01T10:00:00.000Z',
        notes: '',
        measurement: { method: 'volumetric', season: 'dry', trials: [{ volumeL: -20, seconds: 0 }] },
      },
      'metric',
    );
    expect(refused?.name).toBe('RecordRefused');
    const messages = refused?.messages ?? {};
    expect(Object.keys(messages)).toEqual(expect.arrayContaining(['measurement.trials.0.volumeL', 'measurement.trials.0.seconds']));
    expect(Object.values(messages).join(' ')).toMatch(/bucket|volume/i);
    for (const message of Object.values(messages)) expect(message).not.toMatch(/too_small|expected|measurement\./i);
  });
});
