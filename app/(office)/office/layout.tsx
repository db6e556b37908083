import { AppHeader } from '@/components/app-header';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { OfficeNav } from './_components/office-nav';
import { OfficeProviders } from './_components/providers';

export default async function OfficeLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser(['coordinator'], '/office');
  return (
    <>
      <AppHeader user={user} />
      <OfficeNav />
      <OfficeProviders>
        <main className="mx-auto max-w-6xl px-4 py-6">{children}</main>
      </OfficeProviders>
    </>
  );
}
