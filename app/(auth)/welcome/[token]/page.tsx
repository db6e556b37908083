import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '@/components/ui/card';
import { INVITATION_GONE, invitationState } from '@/lib/server/data/invitations';
import { SetPasswordForm } from './_components/set-password-form';

export const metadata: Metadata = { title: 'Welcome', robots: { index: false } };

// Public: the token in the path is the only key; it is checked against its stored hash.
export default async function WelcomePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = await invitationState(token);
  return (
    <main className="mx-auto flex min-h-dvh max-w-md flex-col justify-center px-5 py-10">
      <h1 className="text-4xl font-bold text-slate">Welcome to Fallbook</h1>
      {invitation.state === 'valid' ? (
        <>
          <p className="mt-2 text-lg">
            {invitation.name}, choose a password for <strong>{invitation.email}</strong> with {invitation.organisation}.
          </p>
          <SetPasswordForm token={token} email={invitation.email ?? ''} />
        </>
      ) : (
        <>
          <Card as="p" tone="alarm" padding="md" className="mt-4 text-lg font-bold text-clay" role="alert">
            {INVITATION_GONE[invitation.state]}
          </Card>
          <p className="mt-4">
            <Link href="/login">Go to sign in</Link>
          </p>
        </>
      )}
    </main>
  );
}
