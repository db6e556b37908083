import { VerdictMark } from '@/components/verdict-mark';
import type { SheetView } from '@/lib/shared/sheet/view-model';
import { ProfileDrawing } from './profile-drawing';
import { SiteMapDrawing } from './site-map-drawing';
import { SourceList } from './source-list';

/**
 * A section of the sheet. A `deferred` one is laid out only when the reader scrolls near it
 * (content-visibility; paper lays out everything): the first layout of the whole sheet, tables and
 * all, was most of the work a phone did to show its first screen. Until then it holds the place of
 * a screenful (afterwards, the size it last had), and its words stay in the page for find-in-page
 * and screen readers. Sections with links or buttons are never deferred: laid out by a checker
 * while deferred, a section's content runs past its placeholder over what follows, and targets
 * must not overlap.
 */
function Section({ title, children, deferred = false }: { title: string; children: React.ReactNode; deferred?: boolean }) {
  return (
    <section
      className={`space-y-3 break-inside-avoid-page ${deferred ? '[contain-intrinsic-size:auto_40rem] [content-visibility:auto] print:[content-visibility:visible]' : ''}`}
    >
      <h2 className="border-b border-rule pb-1 text-xl font-bold text-slate">{title}</h2>
      {children}
    </section>
  );
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
      <Section title="How we worked this out">
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
