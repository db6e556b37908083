'use client';

import type { UseFormRegisterReturn } from 'react-hook-form';
import { PastDayConfirm } from '@/components/past-day-confirm';
import { Input, Select } from '@/components/ui/control';
import { Field } from '@/components/ui/field';

interface Props {
  advisors: { id: string; name: string }[];
  /** The advisor select's field, its label, the first option's words and its message. */
  advisor: { field: UseFormRegisterReturn; label: string; none: string; message?: string };
  /** The planned day's field, its label, its message, the tick that confirms a past day, and the day as typed. */
  day: { field: UseFormRegisterReturn; label: string; message?: string; confirmPast: UseFormRegisterReturn; value: string | null | undefined };
}

/** Who walks the site and on which day: the two fields a new visit and an assignment share. */
export function AdvisorAndDayFields({ advisors, advisor, day }: Props) {
  return (
    <>
      <Field id="advisorId" label={advisor.label} message={advisor.message}>
        {(control) => (
          <Select {...control} {...advisor.field}>
            <option value="">{advisor.none}</option>
            {advisors.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <Field id="plannedOn" label={day.label} message={day.message} issue={<PastDayConfirm day={day.value} field={day.confirmPast} />}>
        {(control) => <Input {...control} type="date" {...day.field} />}
      </Field>
    </>
  );
}
