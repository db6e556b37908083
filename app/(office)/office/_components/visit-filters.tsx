'use client';

import { useEffect, useState } from 'react';
import { Card } from '@/components/ui/card';
import { Input, Select } from '@/components/ui/control';
import { VERDICT_WORDS, VERDICTS, VISIT_STATUS_LABELS, VISIT_STATUSES } from '@/lib/shared/domain';

export interface Option {
  id: string;
  name: string;
}

/** The filters of the visits table; every change goes straight into the page's URL. */
export function VisitFilters({
  values,
  advisors,
  areas,
  onChange,
}: {
  values: Record<string, string>;
  advisors: Option[];
  areas: string[];
  onChange: (patch: Record<string, string>) => void;
}) {
  const [q, setQ] = useState(values.q ?? '');
  // Typing waits a moment before it asks the server, so each keystroke is not a request.
  useEffect(() => {
    if ((values.q ?? '') === q) return;
    const t = setTimeout(() => onChange({ q }), 350);
    return () => clearTimeout(t);
  }, [q, values.q, onChange]);

  const select = (name: string, label: string, options: { value: string; label: string }[]) => (
    <label className="block font-bold">
      {label}
      <Select className="text-base" value={values[name] ?? ''} onChange={(e) => onChange({ [name]: e.target.value })}>
        <option value="">Any</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </Select>
    </label>
  );

  return (
    <Card
      as="form"
      role="search"
      aria-label="Filter visits"
      onSubmit={(e: React.FormEvent) => {
        e.preventDefault();
        onChange({ q });
      }}
      padding="md"
      className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4"
    >
      <label className="block font-bold sm:col-span-2">
        Farm or farmer
        <Input type="search" className="text-base" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Part of a name" />
      </label>
      {select(
        'status',
        'State',
        VISIT_STATUSES.map((s) => ({ value: s, label: VISIT_STATUS_LABELS[s] })),
      )}
      {select('advisor', 'Advisor', [{ value: 'none', label: 'Not assigned' }, ...advisors.map((a) => ({ value: a.id, label: a.name }))])}
      {select('verdict', 'Screening', [...VERDICTS.map((v) => ({ value: v, label: VERDICT_WORDS[v] })), { value: 'none', label: 'Not screened' }])}
      {select(
        'area',
        'Area',
        areas.map((a) => ({ value: a, label: a })),
      )}
      <label className="block font-bold">
        Planned from
        <Input type="date" className="text-base" value={values.plannedFrom ?? ''} onChange={(e) => onChange({ plannedFrom: e.target.value })} />
      </label>
      <label className="block font-bold">
        Planned to
        <Input type="date" className="text-base" value={values.plannedTo ?? ''} onChange={(e) => onChange({ plannedTo: e.target.value })} />
      </label>
      <label className="flex min-h-12 items-center gap-2 font-bold">
        <input type="checkbox" className="h-6 w-6" checked={values.overdue === '1'} onChange={(e) => onChange({ overdue: e.target.checked ? '1' : '' })} />
        Only overdue
      </label>
    </Card>
  );
}
