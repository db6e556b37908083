import { PageShell } from '@/components/ui/page-shell';
import { requirePageUser } from '@/lib/server/auth/page-guard';

export default async function FarmLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser(['farmer'], '/farm');
  return <PageShell user={user}>{children}</PageShell>;
}
