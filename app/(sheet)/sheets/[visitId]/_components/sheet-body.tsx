import { VerdictMark } from '@/components/verdict-mark';
import type { SheetView } from '@/lib/shared/sheet/view-model';
import { ProfileDrawing } from './profile-drawing';
import { SiteMapDrawing } from './site-map-drawing';
import { SourceList } from './source-list';

/** A deferred part's stand-in height before it is first laid out: on a phone, and from 640 px up. */
interface Placeholder {
  narrowRem: number;
  wideRem: number;
}

const SCREENFUL: Placeholder = { narrowRem: 40, wideRem: 40 };

// The stand-in height comes from two custom properties (set per part), picked by the breakpoint.
const DEFERRED =
  '[content-visibility:auto] [contain-intrinsic-size:auto_var(--stand-in-narrow)] sm:[contain-intrinsic-size:auto_var(--stand-in-wide)] print:[content-visibility:visible]';
const placeholderStyle = (p: Placeholder) => ({ '--stand-in-narrow': `${p.narrowRem}rem`, '--stand-in-wide': `${p.wideRem}rem` }) as React.CSSProperties;

/**
 * A section of the sheet. A `deferred` one is laid out only when the reader scrolls near it
 * (content-visibility; paper lays out everything): the first layout of the whole sheet, tables and
 * all, was most of the work a phone did to show its first screen. Until then it holds the place of
 * its placeholder (afterwards, the size it last had), and its words stay in the page for
 * find-in-page and screen readers. A section with links or buttons needs a placeholder at least as
 * tall as its content on the narrowest screen of each width: a checker that measures a link while
 * the section is deferred lays the content out inside the placeholder, and content running past it
 * would sit over what follows (targets must not overlap).
 */
function Section({
  title,
  children,
  deferred = false,
  placeholder = SCREENFUL,
}: {
  title: string;
  children: React.ReactNode;
  deferred?: boolean;
  placeholder?: Placeholder;
}) {
  return (
    <section className={`space-y-3 break-inside-avoid-page ${deferred ? DEFERRED : ''}`} style={deferred ? placeholderStyle(placeholder) : undefined}>
      <h2 className="border-b border-rule pb-1 text-xl font-bold text-slate">{title}</h2>
      {children}
    </section>
  );
}

/** A part of the page after the sheet (the conversation, the farmer's answer), deferred like a `Section`. */
export function Deferred({ placeholder, children }: { placeholder: Placeholder; children: React.ReactNode }) {
  return (
    <div className={DEFERRED} style={placeholderStyle(placeholder)}>
      {children}
    </div>
  );
}

/**
 * The height lines of text need, rounded up, with `extraRem` for headings and gaps: each line of the
 * sheet's type 1.75 rem with its spacing; about 26 characters to a line on a 320 px phone, and
 * about 48 from 640 px up (the sheet is at most 70 characters wide).
 */
export function textPlaceholder(lines: string[], extraRem: number): Placeholder {
  const height = (perLine: number) => extraRem + lines.reduce((sum, line) => sum + Math.max(1, Math.ceil(line.length / perLine)) * 1.75 + 0.75, 0);
  return { narrowRem: Math.ceil(height(26)), wideRem: Math.ceil(height(48)) };
}

/** The farmer's sheet: the same words and numbers as the PDF, laid out for a phone and for paper. */
export function SheetBody({ v }: { v: SheetView }) {
  return (
    <article className="max-w-[70ch] space-y-8 text-lg">
      <header className="space-y-3">
        <p className="text-stone">Site sheet for a hydraulic ram pump</p>
        <h1 className="text-3xl font-bold text-slate">{v.farmName}</h1>
        <p className="text-stone">{[v.area, v.ownerName ? `for ${v.ownerName}` : ''].filter(Boolean).join(' · ')}</p>
        <p className="text-2xl" data-testid="verdict">
          <VerdictMark verdict={v.verdict} size={32} />
        </p>
        <p className="text-xl leading-relaxed">{v.summary.join(' ')}</p>
      </header>
      <Section title="Key figures" deferred>
        <dl className="divide-y divide-rule">
          {v.figures.map((f) => (
            <div key={f.key} className="flex flex-wrap items-baseline justify-between gap-x-4 py-2">
              <dt>
                <span className="block">{f.label}</span>
                {f.note && <span className="block text-base text-stone">{f.note}</span>}
              </dt>
              <dd className="figure text-right font-semibold">{f.value}</dd>
            </div>
          ))}
        </dl>
      </Section>
      {v.profile && (
        <Section title="The water path, from intake to tank" deferred>
          <ProfileDrawing g={v.profile} narrow={v.profileNarrow} />
        </Section>
      )}
      {v.map && (
        <Section title="Where the points are" deferred>
          <SiteMapDrawing g={v.map} />
        </Section>
      )}
      <Section deferred title={v.verdict === 'no-go' ? 'Why not' : v.verdict === 'gravity' ? 'What to check' : 'Conditions for a go'}>
        {v.conditions.length === 0 && v.verdict !== 'no-go' && <p>No extra conditions: follow the cautions below.</p>}
        <ul className="list-disc space-y-2 pl-6">
          {[...v.conditions, ...v.reasons].map((text) => (
            <li key={text}>{text}</li>
          ))}
        </ul>
      </Section>
      <Section title="Bill of materials" deferred>
        {/* Five columns that fit a 412 px phone: small type, words allowed to break, the note under the item. */}
        <table className="w-full table-fixed border-collapse text-left text-sm sm:text-base" data-testid="bill-table">
          <colgroup>
            <col className="w-[30%]" />
            <col className="w-[17%]" />
            <col className="w-[14%]" />
            <col className="w-[23%]" />
            <col className="w-[16%]" />
          </colgroup>
          <thead>
            <tr className="border-b-2 border-ink">
              <th scope="col" className="py-2 pr-2">
                Item
              </th>
              <th scope="col" className="py-2 pr-2">
                Size
              </th>
              <th scope="col" className="py-2 pr-2">
                Quantity
              </th>
              <th scope="col" className="py-2 pr-2">
                Basis
              </th>
              <th scope="col" className="py-2 text-right">
                Price
              </th>
            </tr>
          </thead>
          <tbody>
            {v.billOfMaterials.map((b) => (
              <tr key={b.item} className="border-b border-rule align-top">
                <td className="break-words py-2 pr-2">
                  <span className="block">{b.item}</span>
                  <span className="block text-xs text-stone sm:text-sm">{b.note}</span>
                </td>
                <td className="figure break-words py-2 pr-2">{b.size}</td>
                <td className="figure break-words py-2 pr-2">{b.quantity}</td>
                <td className="break-words py-2 pr-2 text-stone">{b.basis}</td>
                <td className="figure py-2 text-right">{b.price}</td>
              </tr>
            ))}
            {v.costs?.extras.map((e) => (
              <tr key={e.item} className="border-b border-rule align-top">
                <td className="break-words py-2 pr-2" colSpan={3}>
                  {e.item}
                </td>
                <td className="break-words py-2 pr-2 text-stone">{e.basis}</td>
                <td className="figure py-2 text-right">{e.price}</td>
              </tr>
            ))}
          </tbody>
          {v.costs && (
            <tfoot>
              <tr className="border-t-2 border-ink font-bold">
                <th scope="row" colSpan={4} className="py-2 pr-2">
                  Total
                </th>
                <td className="figure py-2 text-right" data-testid="bill-total">
                  {v.costs.total}
                </td>
              </tr>
            </tfoot>
          )}
        </table>
      </Section>
      {v.costs?.comparison && (
        <Section title="Ten years: a ram, a solar pump or a petrol pump" deferred>
          <table className="w-full table-fixed border-collapse text-left text-sm sm:text-base" data-testid="ten-year-table">
            <colgroup>
              <col className="w-[28%]" />
              <col className="w-[18%]" />
              <col className="w-[18%]" />
              <col className="w-[18%]" />
              <col className="w-[18%]" />
            </colgroup>
            <thead>
              <tr className="border-b-2 border-ink">
                <th scope="col" className="py-2 pr-2">
                  Option
                </th>
                <th scope="col" className="py-2 pr-2 text-right">
                  To buy and fit
                </th>
                <th scope="col" className="py-2 pr-2 text-right">
                  Bought again
                </th>
                <th scope="col" className="py-2 pr-2 text-right">
                  Upkeep and fuel
                </th>
                <th scope="col" className="py-2 text-right">
                  Ten years
                </th>
              </tr>
            </thead>
            <tbody>
              {v.costs.comparison.map((o) => (
                <tr key={o.option} className="border-b border-rule align-top">
                  <th scope="row" className="break-words py-2 pr-2 font-normal">
                    {o.option}
                  </th>
                  <td className="figure py-2 pr-2 text-right">{o.capital}</td>
                  <td className="figure py-2 pr-2 text-right">{o.replacements}</td>
                  <td className="figure py-2 pr-2 text-right">{o.running}</td>
                  <td className="figure py-2 text-right font-bold">{o.total}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <h3 className="font-bold">What these figures assume</h3>
          <ul className="list-disc space-y-1 pl-6 text-base">
            {v.costs.assumptions.map((a) => (
              <li key={a}>{a}</li>
            ))}
          </ul>
        </Section>
      )}
      {v.costs && !v.costs.comparison && <p className="text-base text-stone">{v.costs.assumptions[0]}</p>}
      <Section title="Cautions" deferred>
        {v.cautions.map((c) => (
          <div key={c.code}>
            <h3 className="font-bold">{c.title}</h3>
            <p>{c.text}</p>
          </div>
        ))}
        <p className="font-bold">Local codes and licensed practice come first: have a qualified person check the design before you buy or build.</p>
      </Section>
      <Section
        title="How we worked this out"
        deferred
        placeholder={textPlaceholder([v.surveyed, ...v.method, ...v.sources.map((src) => src.citation), v.engineVersion], 12)}
      >
        <p>{v.surveyed}</p>
        <ul className="space-y-1 text-base">
          {v.method.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
        <h3 className="font-bold">Where the numbers come from</h3>
        <SourceList sources={v.sources} />
        <p className="text-base text-stone">
          Screening engine version <span className="figure">{v.engineVersion}</span>.
        </p>
      </Section>
    </article>
  );
}
