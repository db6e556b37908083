import type { Metadata } from 'next';
import { ButtonLink } from '@/components/ui/button';
import { forbidden, notFound } from 'next/navigation';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { can } from '@/lib/server/auth/permissions';
import { listSheetResponses } from '@/lib/server/data/sheet-responses';
import { loadSheet } from '@/lib/server/data/sheets';
import { AppError } from '@/lib/server/errors';
import { idParam } from '@/lib/shared/schemas/list-query';
import { buildSheetView } from '@/lib/shared/sheet/view-model';
import { canMove } from '@/lib/shared/visit-states';
import { FarmerReply } from './_components/farmer-reply';
import { ResponsesList } from './_components/responses-list';
import { SendSection } from './_components/send-section';
import { Deferred, SheetBody, textPlaceholder } from './_components/sheet-body';

export const metadata: Metadata = { title: 'Site sheet' };

// The data layer's 403/404 become the app's 403 and 404 pages.
async function loadOrPage(load: () => ReturnType<typeof loadSheet>) {
  try {
    return await load();
  } catch (error) {
    if (error instanceof AppError && error.status === 403) forbidden();
    if (error instanceof AppError && error.status === 404) notFound();
    throw error;
  }
}

export default async function SheetPage({ params }: { params: Promise<{ visitId: string }> }) {
  const { visitId } = await params;
  const user = await requirePageUser(['coordinator', 'advisor', 'farmer'], `/sheets/${visitId}`);
  if (!idParam.safeParse({ id: visitId }).success) notFound();
  const sheet = await loadOrPage(() => loadSheet(user, visitId));
  const view = buildSheetView(sheet.source, user.units);
  const responses = await listSheetResponses(user, visitId);
  const paper = user.units === 'us' ? 'letter' : 'a4';
  const ownership = { organisationId: sheet.visit.organisationId, ownerId: sheet.farmer?.id ?? null };
  const canSend = can(user, 'sheet:send', { ...ownership, advisorIds: sheet.advisorId ? [sheet.advisorId] : [] });
  const canReply = can(user, 'sheet:acknowledge', ownership);
  const canAnswer = can(user, 'sheet:answer', { ...ownership, advisorIds: sheet.advisorId ? [sheet.advisorId] : [] });
  const decided = responses.filter((r) => r.kind === 'go-ahead' || r.kind === 'not-now').at(-1);
  const lastDecision = decided ? (decided.kind as 'go-ahead' | 'not-now') : null;
  return (
    <div className="space-y-8">
      {/* The sheet arrives whole in one response: drawn once it is all read, not once per stretch the
          parser reads (each a full layout and paint, 70 to 120 ms on a slow phone). React places
          the link in the head; the browser draws anyway when the document ends without the mark. */}
      <link rel="expect" href="#sheet-end" blocking="render" />
      <nav aria-label="Sheet as PDF" className="flex flex-wrap gap-3 print:hidden">
        <ButtonLink plain href={`/api/visits/${visitId}/sheet/pdf?paper=${paper}`} download className="text-lg">
          Download PDF ({paper === 'a4' ? 'A4' : 'US Letter'})
        </ButtonLink>
        <ButtonLink plain variant="secondary" href={`/api/visits/${visitId}/sheet/pdf?paper=${paper === 'a4' ? 'letter' : 'a4'}`} download>
          {paper === 'a4' ? 'US Letter' : 'A4'} PDF
        </ButtonLink>
        {canSend && (
          <ButtonLink plain variant="secondary" href="#send-sheet">
            Send this sheet
          </ButtonLink>
        )}
      </nav>
      <SheetBody v={view} />
      {/* Below the sheet, so laid out when the reader gets near (the answer panel is about 37 rem
          tall on a 320 px phone). The advisor's answer form stays out of this: its size changes as
          questions come in. */}
      {canAnswer || responses.length === 0 ? (
        <ResponsesList visitId={visitId} responses={responses} canAnswer={canAnswer} />
      ) : (
        <Deferred
          placeholder={textPlaceholder(
            responses.flatMap((r) => [`${r.author.name} ${r.at}`, r.text]),
            6,
          )}
        >
          <ResponsesList visitId={visitId} responses={responses} canAnswer={canAnswer} />
        </Deferred>
      )}
      {canReply && (
        <Deferred placeholder={{ narrowRem: 48, wideRem: 36 }}>
          <FarmerReply
            visitId={visitId}
            acknowledged={responses.some((r) => r.kind === 'acknowledged')}
            decision={lastDecision}
            canDecide={canMove(sheet.visit.status, 'agreed', 'farmer') || canMove(sheet.visit.status, 'declined', 'farmer')}
          />
        </Deferred>
      )}
      {canSend && <SendSection visitId={visitId} farmerName={sheet.farmer?.name ?? null} farmerEmail={sheet.farmer?.email ?? null} />}
      <div id="sheet-end" hidden />
    </div>
  );
}
