import type { SheetResponseView } from '@/lib/server/data/sheet-responses';

const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });

/** The farmer's acknowledgements and questions, for everyone who reads the sheet. */
export function ResponsesList({ responses }: { responses: SheetResponseView[] }) {
  if (responses.length === 0) return null;
  return (
    <section aria-labelledby="responses-heading" className="space-y-2 print:hidden">
      <h2 id="responses-heading" className="text-xl font-bold text-slate">Questions and answers</h2>
      <ul className="divide-y divide-rule">
        {responses.map((r) => (
          <li key={r.id} className="py-2">
            <span className="block text-stone"><span className="figure">{when(r.at)}</span> · {r.farmer}</span>
            <span className="block">{r.kind === 'acknowledged' ? <strong className="text-moss">Acknowledged the sheet.</strong> : r.text}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}
