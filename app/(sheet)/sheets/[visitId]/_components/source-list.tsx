import type { SheetSourceLine } from '@/lib/shared/sheet/view-model';

/** "Where the numbers come from": each source by its name, a link to the document where it has an address. */
export function SourceList({ sources }: { sources: SheetSourceLine[] }) {
  return (
    <ul className="space-y-1 text-base text-stone">
      {sources.map((s) => (
        <li key={s.id}>
          {s.url ? (
            // Underlined as well as coloured, so a link does not rest on colour alone; a block of its own line height
            // and more, so a thumb finds it (targets of 24 px at least); on paper the name reads as plain text.
            <a href={s.url} target="_blank" rel="noopener noreferrer" className="inline-block py-1 underline print:py-0 print:text-inherit print:no-underline">
              {s.citation}
              <span className="sr-only"> (opens in a new tab)</span>
            </a>
          ) : (
            s.citation
          )}
        </li>
      ))}
    </ul>
  );
}
