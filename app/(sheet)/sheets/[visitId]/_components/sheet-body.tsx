import { VerdictMark } from '@/components/verdict-mark';
import type { SheetView } from '@/lib/shared/sheet/view-model';
import { ProfileDrawing } from './profile-drawing';
import { SiteMapDrawing } from './site-map-drawing';

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section className="space-y-3 break-inside-avoid-page">
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
        <p className="text-2xl" data-testid="verdict"><VerdictMark verdict={v.verdict} size={32} /></p>
        <p className="text-xl leading-relaxed">{v.summary.join(' ')}</p>
      </header>
      <Section title="Key figures">
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
      {v.profile && <Section title="The water path, from intake to tank"><ProfileDrawing g={v.profile} narrow={v.profileNarrow} /></Section>}
      {v.map && <Section title="Where the points are"><SiteMapDrawing g={v.map} /></Section>}
      <Section title={v.verdict === 'no-go' ? 'Why not' : v.verdict === 'gravity' ? 'What to check' : 'Conditions for a go'}>
        {v.conditions.length === 0 && v.verdict !== 'no-go' && <p>No extra conditions: follow the cautions below.</p>}
        <ul className="list-disc space-y-2 pl-6">
          {[...v.conditions, ...v.reasons].map((text) => <li key={text}>{text}</li>)}
        </ul>
      </Section>
      <Section title="Bill of materials">
        <table className="w-full border-collapse text-left text-base">
          <thead>
            <tr className="border-b-2 border-ink"><th scope="col" className="py-2 pr-3">Item</th><th scope="col" className="py-2 pr-3">Size</th><th scope="col" className="py-2">How many</th></tr>
          </thead>
          <tbody>
            {v.billOfMaterials.map((b) => (
              <tr key={b.item} className="border-b border-rule align-top">
                <td className="py-2 pr-3"><span className="block">{b.item}</span><span className="block text-stone">{b.note}</span></td>
                <td className="figure py-2 pr-3">{b.size}</td>
                <td className="figure py-2">{b.quantity}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>
      <Section title="Cautions">
        {v.cautions.map((c) => (
          <div key={c.code}><h3 className="font-bold">{c.title}</h3><p>{c.text}</p></div>
        ))}
        <p className="font-bold">Local codes and licensed practice come first: have a qualified person check the design before you buy or build.</p>
      </Section>
      <Section title="How we worked this out">
        <p>{v.surveyed}</p>
        <ul className="space-y-1 text-base">{v.method.map((m) => <li key={m}>{m}</li>)}</ul>
        <h3 className="font-bold">Where the numbers come from</h3>
        <ul className="space-y-1 text-base text-stone">{v.sources.map((s) => <li key={s.id}>{s.citation}</li>)}</ul>
        <p className="text-base text-stone">Screening engine version <span className="figure">{v.engineVersion}</span>.</p>
      </Section>
    </article>
  );
}
