import { PageShell } from '@/components/ui/page-shell';
import { requirePageUser } from '@/lib/server/auth/page-guard';

export default async function OfficeLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser(['coordinator'], '/office');
  return <PageShell user={user}>{children}</PageShell>;
}
