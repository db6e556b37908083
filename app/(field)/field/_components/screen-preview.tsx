'use client';

import { useFieldQuery } from './use-field-query';
import { Card } from '@/components/ui/card';
import { VerdictMark } from '@/components/verdict-mark';
import { screenSite } from '@/lib/engine';
import { NOMINAL_SIZES } from '@/lib/engine/materials';
import { localSiteReadings } from '@/lib/client/site-readings';
import Link from 'next/link';
import { showQuantity } from '@/lib/shared/display/quantities';
import { plainIssueMessage } from '@/lib/shared/field-messages';
import { readingIssues } from '@/lib/shared/reading-issues';
import { siteReadingsSchema } from '@/lib/shared/schemas/site-readings';
import { plainTrade } from '@/lib/shared/sheet/trade-words';
import { sentence } from '@/lib/shared/sheet/sentence';
import type { UnitSystem } from '@/lib/shared/domain';
import { useUnits } from './use-field-data';

/** The feasibility screen computed on the phone from what is captured so far. */
export function ScreenPreview({ visitId }: { visitId: string }) {
  const units = useUnits();
  const preview = useFieldQuery(
    units === undefined
      ? null
      : async () => {
          const input = await localSiteReadings(visitId);
          if (!input) return null;
          const parsed = siteReadingsSchema.safeParse(input, { error: (issue) => plainIssueMessage(issue, units) });
          if (!parsed.success) return { kind: 'missing' as const, missing: readingIssues(parsed.error.issues) };
          return { kind: 'screened' as const, screening: screenSite(parsed.data) };
        },
    [visitId, units],
  );
  // Nothing until the reader's units are known: the figures are shown in them.
  if (!preview || units === undefined) return null;
  return (
    <Card as="section" tone="strong" aria-labelledby="preview">
      <h2 id="preview" className="text-xl font-bold">
        Screen preview (on this phone)
      </h2>
      {preview.kind === 'missing' && (
        <div className="mt-2">
          <p>Still needed before the screen can run:</p>
          <ul className="ml-5 list-disc" data-testid="preview-missing">
            {preview.missing.map((m) => (
              <li key={`${m.record}|${m.message}`}>
                <Link href={`/field/visit/${m.page}?id=${visitId}`} className="font-bold">
                  {m.record}
                </Link>
                : {m.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      {preview.kind === 'screened' && (
        <div className="mt-2 space-y-2" data-testid="preview-verdict">
          <VerdictMark verdict={preview.screening.verdict} />
          <p className="figure">
            Delivery {showQuantity(preview.screening.figures.deliveryLpd?.value ?? 0, 'litresPerDay', units)} · demand{' '}
            {showQuantity(preview.screening.figures.demandLpd?.value ?? 0, 'litresPerDay', units)}
          </p>
          <p data-testid="preview-ram">{arrangement(preview.screening.figures, units)}</p>
          <ul className="ml-5 list-disc">
            {preview.screening.reasons.slice(0, 3).map((r) => (
              <li key={r.code}>{sentence(r, units)}</li>
            ))}
          </ul>
          <p className="text-stone">A first check, not an engineering design. The server stores the official screening after sync.</p>
        </div>
      )}
    </Card>
  );
}

type Figures = ReturnType<typeof screenSite>['figures'];

/** What the screen would build, in a line: the rams and their size, or the gravity pipe. */
function arrangement(f: Figures, units: UnitSystem): string {
  const label = (inches: number | null | undefined) => plainTrade(NOMINAL_SIZES.find((s) => s.nominalIn === inches)?.label ?? `${inches}″`, units);
  if (f.gravityHeadM) {
    const size = f.gravityPipeBoreMm?.inputs.nominalIn;
    return typeof size === 'number' ? `No pump: a ${label(size)} pipe fills the tank by gravity.` : 'No pump: the tank sits below the intake.';
  }
  const count = f.ramCount?.value;
  if (!count || !f.ramSizeIn?.value) return 'No ram size fits these readings.';
  return `${count === 1 ? 'One ram' : `${count} rams side by side`} for ${label(f.ramSizeIn.value)} drive pipe, taking ${showQuantity(f.driveFlowLpm?.value ?? 0, 'flowLpm', units)}${count > 1 ? ' each' : ''}.`;
}
