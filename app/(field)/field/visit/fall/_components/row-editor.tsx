'use client';

import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import type { UnitSystem } from '@/lib/shared/domain';
import type { QuantityKind } from '@/lib/shared/display/quantities';
import { NumberField } from '../../../_components/number-field';

export type Row = Record<string, number | undefined>;

export interface Column {
  key: string;
  label: string;
  quantity: QuantityKind;
  signed?: boolean;
}

/** A list of readings rows (level set-ups, hose steps, clinometer legs) with add and remove. */
export function RowEditor({
  title,
  rows,
  columns,
  units,
  onChange,
  addLabel,
  issueAt,
}: {
  title: (index: number, count: number) => string;
  rows: Row[];
  columns: (index: number, count: number) => Column[];
  units: UnitSystem;
  onChange: (rows: Row[]) => void;
  addLabel: string;
  /** The record check's note for a reading (row index, column key). */
  issueAt?: (index: number, key: string) => ReactNode;
}) {
  return (
    <div className="space-y-3">
      {rows.map((row, i) => (
        <Card as="fieldset" padding="md" key={i}>
          <legend className="px-1 font-bold">{title(i, rows.length)}</legend>
          <div className="grid gap-3 sm:grid-cols-2">
            {columns(i, rows.length).map((c) => (
              <NumberField
                key={c.key}
                label={c.label}
                quantity={c.quantity}
                units={units}
                signed={c.signed}
                value={row[c.key]}
                onChange={(v) => onChange(rows.map((r, j) => (j === i ? { ...r, [c.key]: v } : r)))}
              >
                {issueAt?.(i, c.key)}
              </NumberField>
            ))}
          </div>
          {rows.length > 1 && (
            <Button variant="quiet" size="sm" className="mt-2" onClick={() => onChange(rows.filter((_, j) => j !== i))}>
              Remove
            </Button>
          )}
        </Card>
      ))}
      <Button variant="secondary" size="wide" onClick={() => onChange([...rows, {}])}>
        {addLabel}
      </Button>
    </div>
  );
}
