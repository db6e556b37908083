'use client';

import { useId, useState, type ReactNode } from 'react';
import { Input } from '@/components/ui/control';
import { Field } from '@/components/ui/field';
import type { UnitSystem } from '@/lib/shared/domain';
import { QUANTITIES, typedQuantity, type QuantityKind } from '@/lib/shared/display/quantities';
import { parseFieldNumber } from '@/lib/shared/units';

interface Props {
  label: string;
  quantity: QuantityKind;
  units: UnitSystem;
  /** SI value, undefined when empty. */
  value: number | undefined;
  onChange: (si: number | undefined) => void;
  hint?: string;
  /** A ± key: the phone's decimal pad has no minus. */
  signed?: boolean;
  name?: string;
  /** The record check's message or question for this field (see record-check.tsx). */
  children?: ReactNode;
}

/** A reading typed on a phone: decimal keypad, "." or ",", its unit beside it, stored in SI. */
export function NumberField({ label, quantity, units, value, onChange, hint, signed, name, children }: Props) {
  const id = useId();
  const display = QUANTITIES[quantity][units];
  // A stored value is shown rounded ("5.28" gal, not "5.283441"); left as shown it keeps its exact SI value.
  const shown = (si: number | undefined) => typedQuantity(si, quantity, units);
  const [text, setText] = useState(shown(value));
  const [prefill, setPrefill] = useState({ text: shown(value), si: value });
  const [error, setError] = useState<string | null>(null);

  // Follow outside changes (a reset, a unit switch) without fighting the person's typing:
  // the "previous props in state" pattern, adjusted during render.
  const [seen, setSeen] = useState({ value, units });
  if (seen.value !== value || seen.units !== units) {
    setSeen({ value, units });
    const parsed = parseFieldNumber(text);
    const typed = parsed.ok ? display.toSi(parsed.value) : undefined;
    const agrees = value === undefined ? !parsed.ok : text === prefill.text ? prefill.si === value : typed !== undefined && Math.abs(typed - value) <= 1e-9;
    if (!agrees || seen.units !== units) {
      setText(shown(value));
      setPrefill({ text: shown(value), si: value });
    }
  }

  function update(next: string) {
    setText(next);
    const parsed = parseFieldNumber(next);
    if (parsed.ok) {
      setError(null);
      // Typed back to what was shown: the stored value, not its rounding.
      onChange(next.trim() === prefill.text && prefill.si !== undefined ? prefill.si : display.toSi(parsed.value));
    } else {
      setError(parsed.error === 'empty' ? null : 'Type a number, like 1.25 or 1,25.');
      onChange(undefined);
    }
  }

  return (
    <Field id={id} label={label} hint={hint ?? ''} message={error} issue={children}>
      {(control) => (
        <div className="mt-1 flex items-stretch gap-2">
          {signed && (
            <button
              type="button"
              aria-label={`Change the sign of ${label}`}
              onClick={() => update(text.startsWith('-') ? text.slice(1) : `-${text}`)}
              className="min-h-14 min-w-14 rounded-md border-2 border-stone bg-white text-2xl font-bold"
            >
              ±
            </button>
          )}
          <Input
            {...control}
            look="phone"
            className="figure min-w-0 text-2xl"
            name={name}
            type="text"
            inputMode="decimal"
            autoComplete="off"
            value={text}
            onChange={(e) => update(e.target.value)}
          />
          {display.unit && <span className="figure flex min-w-14 shrink-0 items-center text-xl text-stone">{display.unit}</span>}
        </div>
      )}
    </Field>
  );
}
