import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/server/auth/page-guard';
import { listInvitations } from '@/lib/server/data/invitations';
import { listPeople } from '@/lib/server/data/people';
import { ActiveSwitch } from './_components/active-switch';
import { InviteForm } from './_components/invite-form';

export const metadata: Metadata = { title: 'People' };
const ROLE = { coordinator: 'Coordinator', advisor: 'Field advisor', farmer: 'Farmer' } as const;
const STATE = { waiting: 'Waiting', used: 'Accepted', expired: 'Expired' } as const;

export default async function PeoplePage() {
  const user = await requirePageUser(['coordinator'], '/office/people');
  const [people, invitations] = await Promise.all([listPeople(user, { page: 1, pageSize: 100 }), listInvitations(user)]);
  return (
    <div className="space-y-8">
      <h1 className="text-3xl font-bold text-slate">People</h1>
      <section aria-labelledby="invite" className="space-y-3">
        <h2 id="invite" className="text-xl font-bold">
          Invite someone
        </h2>
        <InviteForm />
      </section>
      <section aria-labelledby="accounts" className="space-y-3">
        <h2 id="accounts" className="text-xl font-bold">
          Accounts
        </h2>
        <table className="w-full border-collapse text-left" aria-label="Accounts">
          <thead>
            <tr className="border-b-2 border-ink">
              <th className="py-2 pr-3">Name</th>
              <th className="py-2 pr-3">Role</th>
              <th className="py-2 pr-3">Account</th>
              <th className="py-2" />
            </tr>
          </thead>
          <tbody>
            {people.items.map((p) => (
              <tr key={p.id} className="border-b border-rule align-top">
                <td className="py-3 pr-3">
                  <span className="block font-bold">{p.name}</span>
                  <span className="block text-stone">{p.email}</span>
                </td>
                <td className="py-3 pr-3">{ROLE[p.role]}</td>
                <td className="py-3 pr-3">{p.active ? 'Active' : <strong className="text-clay">Switched off</strong>}</td>
                <td className="py-3">{p.id !== user.id && <ActiveSwitch id={p.id} name={p.name} active={p.active} />}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      {invitations.length > 0 && (
        <section aria-labelledby="invitations" className="space-y-3">
          <h2 id="invitations" className="text-xl font-bold">
            Recent invitations
          </h2>
          <ul className="divide-y divide-rule border-y border-rule">
            {invitations.map((i) => (
              <li key={i.id} className="py-2">
                {i.name} · {i.email} · {ROLE[i.role]} · <strong>{STATE[i.state]}</strong>
                {i.state === 'waiting' && ` until ${i.expiresAt.slice(0, 10)}`}
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
