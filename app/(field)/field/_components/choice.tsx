'use client';

import Link from 'next/link';
import { useId } from 'react';
import { Button } from '@/components/ui/button';

/** A row of large toggle buttons for a small set of choices (methods, seasons, roles). */
export function Choice<T extends string>({
  label,
  options,
  value,
  onChange,
}: {
  label: string;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
}) {
  return (
    <fieldset>
      <legend className="font-bold">{label}</legend>
      <div className="mt-1 flex flex-wrap gap-2">
        {options.map((o) => (
          <button
            key={o.value}
            type="button"
            aria-pressed={o.value === value}
            onClick={() => onChange(o.value)}
            className={`min-h-12 rounded-md border-2 px-4 font-bold ${o.value === value ? 'border-slate bg-slate text-white' : 'border-stone bg-white text-ink'}`}
          >
            {o.label}
          </button>
        ))}
      </div>
    </fieldset>
  );
}

/** The full-width primary action at thumb height. */
export function PrimaryButton({
  children,
  onClick,
  disabled,
  why,
  type = 'button',
}: {
  children: React.ReactNode;
  onClick?: () => void;
  disabled?: boolean;
  /** Why the button cannot be used yet, shown under it while it is disabled: a greyed button never stands unexplained. */
  why?: string;
  type?: 'button' | 'submit';
}) {
  const id = useId();
  const note = disabled && why ? why : null;
  return (
    <div>
      <Button size="xl" className="w-full disabled:opacity-50" type={type} onClick={onClick} disabled={disabled} aria-describedby={note ? id : undefined}>
        {children}
      </Button>
      {note && (
        <p id={id} className="mt-1 text-stone" data-testid="disabled-why">
          {note}
        </p>
      )}
    </div>
  );
}

/** Page heading with the way back to the visit. */
export function SectionHeader({ visitId, title }: { visitId: string; title: string }) {
  return (
    <div>
      <Link href={`/field/visit?id=${visitId}`}>← Back to the visit</Link>
      <h1 className="mt-2 text-3xl font-bold text-slate">{title}</h1>
    </div>
  );
}
