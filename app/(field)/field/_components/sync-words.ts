// The counts of what waits, in the same words on the home, the sync bar and the sync page: changes
// and photos waiting to send (the sync sends them), changes that need the person's decision (the
// sync does not send them until the person decides).
import { formatCount } from '@/lib/shared/display/numbers';

export interface WaitingCounts {
  waiting: number;
  photos: number;
  parked: number;
}

/** "Everything is on the server", or what waits: "3 changes and 1 photo waiting to send". */
export function waitingWords(c: WaitingCounts): string {
  if (c.waiting + c.photos + c.parked === 0) return 'Everything is on the server';
  if (c.waiting + c.photos === 0) return 'Nothing waiting to send';
  const parts = [c.waiting > 0 && formatCount(c.waiting, 'change'), c.photos > 0 && formatCount(c.photos, 'photo')].filter(Boolean);
  return `${parts.join(' and ')} waiting to send`;
}

/** "1 change needs your decision", "7 changes need your decision". */
export function decisionWords(parked: number): string {
  return `${formatCount(parked, 'change')} ${parked === 1 ? 'needs' : 'need'} your decision`;
}
