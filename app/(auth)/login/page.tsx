import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { getCurrentUser } from '@/lib/server/auth/current-user';
import { HOME_BY_ROLE } from '@/lib/shared/domain';
import { sameOriginPath } from '@/lib/shared/return-path';
import { SignInForm } from './_components/sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

/** Only a path of this origin is honoured as a return address (its whole path and query). */
const safeReturn = (value: string | string[] | undefined) => sameOriginPath(value, process.env.NEXTAUTH_URL || 'http://localhost');

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const user = await getCurrentUser();
  if (user) redirect(safeReturn(params.callbackUrl) ?? HOME_BY_ROLE[user.role]);
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center px-5 py-10">
      <h1 className="text-4xl font-bold text-slate">Fallbook</h1>
      <p className="mt-2 text-lg">Site screening for ram pumps: from the creek to a plain answer for the farm.</p>
      <SignInForm returnTo={safeReturn(params.callbackUrl)} />
    </main>
  );
}
