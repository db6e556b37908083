import type { Metadata } from 'next';
import { FieldShell } from './_components/field-shell';

export const metadata: Metadata = { title: 'Field book' };

// Static on purpose: the advisor's pages read the phone's database and open with no signal.
// The server checks the session and the assignment on every sync request instead.
export default function FieldLayout({ children }: { children: React.ReactNode }) {
  return <FieldShell>{children}</FieldShell>;
}
