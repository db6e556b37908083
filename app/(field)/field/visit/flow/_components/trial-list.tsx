'use client';

import type { ReactNode } from 'react';
import { Card } from '@/components/ui/card';

/** Trials entered so far, each removable, each with the record check's note under it; big targets for wet fingers. */
export function TrialList({ items, onRemove, issueAt }: { items: string[]; onRemove: (index: number) => void; issueAt?: (index: number) => ReactNode }) {
  if (items.length === 0) return <p className="text-stone">No trials yet.</p>;
  return (
    <Card as="ol" padding="none" className="divide-y divide-rule">
      {items.map((text, i) => (
        <li key={`${i}-${text}`} className="px-3 py-2">
          <div className="flex items-center justify-between">
            <span className="figure text-lg">
              {i + 1}. {text}
            </span>
            <button
              type="button"
              onClick={() => onRemove(i)}
              aria-label={`Remove trial ${i + 1}`}
              className="min-h-12 min-w-12 rounded-md border-2 border-stone font-bold"
            >
              ✕
            </button>
          </div>
          {issueAt?.(i)}
        </li>
      ))}
    </Card>
  );
}
