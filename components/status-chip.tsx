import { VISIT_STATUS_LABELS, type VisitStatus } from '@/lib/shared/domain';

/** A visit's state in words, framed so it reads without colour. */
export function StatusChip({ status }: { status: VisitStatus }) {
  return <span className="inline-block rounded border border-stone px-2 py-0.5 text-sm font-bold text-ink">{VISIT_STATUS_LABELS[status]}</span>;
}
