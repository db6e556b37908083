'use client';

import { Card } from '@/components/ui/card';
import type { UnitSystem } from '@/lib/shared/domain';
import { showQuantity } from '@/lib/shared/display/quantities';

/** Stations of a run drawn as they are booked: reduced level against station number. */
export function ProfileChart({ levelsM, units }: { levelsM: number[]; units: UnitSystem }) {
  if (levelsM.length < 2) return null;
  const w = 320;
  const h = 160;
  const pad = 28;
  const min = Math.min(...levelsM);
  const max = Math.max(...levelsM);
  const span = max - min || 1;
  const x = (i: number) => pad + (i * (w - 2 * pad)) / (levelsM.length - 1);
  const y = (rl: number) => pad + ((max - rl) * (h - 2 * pad)) / span;
  const path = levelsM.map((rl, i) => `${i === 0 ? 'M' : 'L'}${x(i).toFixed(1)},${y(rl).toFixed(1)}`).join(' ');
  return (
    <Card as="figure" padding="sm">
      <svg
        viewBox={`0 0 ${w} ${h}`}
        className="w-full"
        role="img"
        aria-label={`Profile of ${levelsM.length} stations, ${showQuantity(max - min, 'length', units)} from highest to lowest`}
      >
        {[0, 0.5, 1].map((f) => (
          <line key={f} x1={pad} x2={w - pad} y1={pad + f * (h - 2 * pad)} y2={pad + f * (h - 2 * pad)} stroke="#C9C4B6" strokeWidth="1" />
        ))}
        <path d={path} fill="none" stroke="#184F69" strokeWidth="3" />
        {levelsM.map((rl, i) => (
          <g key={i}>
            <circle cx={x(i)} cy={y(rl)} r="5" fill="#15191C" />
            <text x={x(i)} y={h - 6} textAnchor="middle" fontSize="11" fill="#4F555A">
              {i + 1}
            </text>
          </g>
        ))}
      </svg>
      <figcaption className="text-stone">
        Stations as booked (first station at 0). Drop so far:{' '}
        <span className="figure">{showQuantity(levelsM[0]! - levelsM[levelsM.length - 1]!, 'length', units)}</span>
      </figcaption>
    </Card>
  );
}
