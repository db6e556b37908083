import { PageShell } from '@/components/ui/page-shell';
import { requirePageUser } from '@/lib/server/auth/page-guard';

export default async function FieldLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser(['advisor'], '/field');
  return <PageShell user={user}>{children}</PageShell>;
}
