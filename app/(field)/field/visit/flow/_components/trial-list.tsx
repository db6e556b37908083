'use client';

/** Trials entered so far, each removable; big targets for wet fingers. */
export function TrialList({ items, onRemove }: { items: string[]; onRemove: (index: number) => void }) {
  if (items.length === 0) return <p className="text-stone">No trials yet.</p>;
  return (
    <ol className="divide-y divide-rule rounded-md border border-rule bg-white">
      {items.map((text, i) => (
        <li key={`${i}-${text}`} className="flex items-center justify-between px-3 py-2">
          <span className="figure text-lg">{i + 1}. {text}</span>
          <button type="button" onClick={() => onRemove(i)} aria-label={`Remove trial ${i + 1}`}
            className="min-h-12 min-w-12 rounded-md border-2 border-stone font-bold">✕</button>
        </li>
      ))}
    </ol>
  );
}
