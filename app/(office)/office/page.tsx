import type { Metadata } from 'next';
import { Suspense } from 'react';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { districtAreas, visitCountsByAdvisor } from '@/lib/server/data/follow-up';
import { listPeople } from '@/lib/server/data/people';
import { listOpenQuestions } from '@/lib/server/data/sheet-responses';
import { OpenQuestions } from '@/components/open-questions';
import { listDeletedVisits } from '@/lib/server/data/visit-restore';
import { visitCounts } from '@/lib/server/data/visits';
import { DeletedVisits } from './_components/deleted-visits';
import { FollowUpBoard } from './_components/follow-up-board';
import { VisitsBrowser } from './_components/visits-browser';

export const metadata: Metadata = { title: 'District office' };

export default async function OfficeHome() {
  const user = await requirePageUser(['coordinator'], '/office');
  const [counts, loads, people, areas, questions, deleted] = await Promise.all([
    visitCounts(user),
    visitCountsByAdvisor(user),
    listPeople(user, { page: 1, pageSize: 100 }),
    districtAreas(user),
    listOpenQuestions(user),
    listDeletedVisits(user),
  ]);
  const advisors = people.items.filter((p) => p.role === 'advisor' && p.active).map((p) => ({ id: p.id, name: p.name }));
  const total = Object.values(counts.byStatus).reduce((a, b) => a + (b ?? 0), 0);
  return (
    <div className="space-y-8">
      <section>
        <h1 className="text-3xl font-bold text-slate">District office</h1>
        <p className="mt-1 text-lg">
          {total} visits · {advisors.length} active advisors
          {counts.overdue > 0 && <strong className="text-clay"> · {counts.overdue} overdue</strong>}
          {questions.length > 0 && (
            <strong className="text-ochre">
              {' '}
              · {questions.length} open {questions.length === 1 ? 'question' : 'questions'}
            </strong>
          )}
        </p>
      </section>
      <OpenQuestions questions={questions} />
      <FollowUpBoard byStatus={counts.byStatus} overdue={counts.overdue} loads={loads} />
      <section aria-labelledby="visits" className="space-y-3">
        <h2 id="visits" className="text-xl font-bold">
          Visits
        </h2>
        <Suspense fallback={<p>Loading visits…</p>}>
          <VisitsBrowser advisors={advisors} areas={areas} />
        </Suspense>
      </section>
      <DeletedVisits visits={deleted} />
    </div>
  );
}
