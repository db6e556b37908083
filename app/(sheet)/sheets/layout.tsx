import { PageShell } from '@/components/ui/page-shell';
import { requirePageUser } from '@/lib/server/auth/page-guard';

// Sheets are read by the farmer who owns the farm, the assigned advisor and the coordinators:
// a route group of its own, so no audience's home layout stands in the way. No client providers here:
// the sheet is server-rendered, and only the send panel needs TanStack Query (fetched only where it is
// drawn: [visitId]/_components/send-section.tsx).
export default async function SheetLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser(['coordinator', 'advisor', 'farmer'], '/sheets');
  return (
    <div className="print:[&>header]:hidden">
      <PageShell user={user}>{children}</PageShell>
    </div>
  );
}
