import { redirect } from 'next/navigation';
import { getCurrentUser } from '@/lib/server/auth/current-user';
import { HOME_BY_ROLE } from '@/lib/shared/domain';

// Each role has its own home; the front door only sends people there.
export default async function FrontDoor() {
  const user = await getCurrentUser();
  redirect(user ? HOME_BY_ROLE[user.role] : '/login');
}
