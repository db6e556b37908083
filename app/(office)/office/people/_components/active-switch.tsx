'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { apiJson } from '@/lib/client/api';

/** Switches an account off (its sessions end at once) or back on, after a confirmation. */
export function ActiveSwitch({ id, name, active }: { id: string; name: string; active: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function toggle() {
    if (active && !window.confirm(`Switch off ${name}'s account? They are signed out everywhere at once.`)) return;
    setBusy(true);
    setError(null);
    try {
      await apiJson(`/api/people/${id}`, { method: 'PATCH', body: { active: !active } });
      router.refresh();
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Not changed.');
    } finally {
      setBusy(false);
    }
  }
  return (
    <div>
      <Button variant={active ? 'danger' : 'secondary'} size="sm" onClick={toggle} disabled={busy}>
        {active ? `Switch off ${name}` : `Switch on ${name}`}
      </Button>
      {error && (
        <p role="alert" className="mt-1 font-bold text-clay">
          {error}
        </p>
      )}
    </div>
  );
}
