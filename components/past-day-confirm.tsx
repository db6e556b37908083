'use client';

import type { UseFormRegisterReturn } from 'react-hook-form';
import { isPastDay } from '@/lib/shared/visit-rules';

/**
 * The tick box a past planned date needs ("Yes, the date is in the past"), drawn only when the
 * chosen day has passed; the schema refuses a past day without it.
 */
export function PastDayConfirm({
  day,
  field,
  checked,
  onChange,
}: {
  day: string | null | undefined;
  field?: UseFormRegisterReturn;
  checked?: boolean;
  onChange?: (checked: boolean) => void;
}) {
  if (!isPastDay(day)) return null;
  const props = field ?? { checked: !!checked, onChange: (e: React.ChangeEvent<HTMLInputElement>) => onChange?.(e.target.checked) };
  return (
    <label className="mt-2 flex min-h-12 items-center gap-3 rounded-md border-2 border-ochre px-3 font-bold text-ochre">
      <input type="checkbox" className="h-6 w-6" {...props} />
      Yes, the date is in the past
    </label>
  );
}
