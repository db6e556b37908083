'use client';

import { Card } from '@/components/ui/card';
import type { PositionPair, ProfileStation, ProfileTank } from '@/lib/engine';
import type { UnitSystem } from '@/lib/shared/domain';
import { showQuantity } from '@/lib/shared/display/quantities';

/** Colour of ranked pair 1, 2, 3: the chart and the map use the same. */
export const PAIR_COLOURS = ['#1E3A4C', '#184F69', '#6F4700'];

/** The creek profile (level against chainage) with the tank and the ranked pairs drawn intake → ram, numbered. */
export function PositionsChart({
  stations,
  tank,
  pairs,
  units,
}: {
  stations: ProfileStation[];
  tank: ProfileTank | null;
  pairs: PositionPair[];
  units: UnitSystem;
}) {
  if (stations.length < 2) return null;
  const w = 360;
  const h = 200;
  const pad = 30;
  const levels = [...stations.map((s) => s.levelM), ...(tank ? [tank.levelM] : [])];
  const chains = [...stations.map((s) => s.chainageM), ...(tank ? [tank.chainageM] : [])];
  const [lo, hi] = [Math.min(...levels), Math.max(...levels)];
  const [c0, c1] = [Math.min(...chains), Math.max(...chains)];
  const x = (c: number) => pad + ((c - c0) * (w - 2 * pad)) / (c1 - c0 || 1);
  const y = (l: number) => pad + ((hi - l) * (h - 2 * pad)) / (hi - lo || 1);
  const path = stations.map((s, i) => `${i === 0 ? 'M' : 'L'}${x(s.chainageM).toFixed(1)},${y(s.levelM).toFixed(1)}`).join(' ');
  return (
    <Card as="figure" padding="sm">
      <svg
        viewBox={`0 0 ${w} ${h}`}
        className="w-full"
        role="img"
        aria-label={`Creek profile of ${stations.length} stations with the ${pairs.length} best pairs`}
      >
        {[0, 0.5, 1].map((f) => (
          <line key={f} x1={pad} x2={w - pad} y1={pad + f * (h - 2 * pad)} y2={pad + f * (h - 2 * pad)} stroke="#C9C4B6" />
        ))}
        <path d={path} fill="none" stroke="#184F69" strokeWidth="2" />
        {stations.map((s) =>
          s.flags?.includes('no-pump-site') ? (
            <path key={s.id} d={`M ${x(s.chainageM) - 4} ${y(s.levelM) - 4} l 8 8 m 0 -8 l -8 8`} stroke="#8C2F10" strokeWidth="2" />
          ) : (
            <circle key={s.id} cx={x(s.chainageM)} cy={y(s.levelM)} r="3" fill="#15191C" />
          ),
        )}
        {tank && (
          <rect x={x(tank.chainageM) - 6} y={y(tank.levelM) - 6} width="12" height="12" fill="none" stroke="#15191C" strokeWidth="2">
            <title>Tank</title>
          </rect>
        )}
        {pairs.map((p, i) => (
          <g key={`${p.intake.id}-${p.pump.id}`} data-testid={`pair-line-${p.rank}`}>
            {p.standPipe ? (
              <>
                {/* Feed pipe dashed at the intake's water level to the stand pipe; the drive pipe solid from there. */}
                <line
                  x1={x(p.intake.chainageM)}
                  y1={y(p.intake.levelM)}
                  x2={x(p.standPipe.chainageM)}
                  y2={y(p.intake.levelM)}
                  stroke={PAIR_COLOURS[i] ?? '#4F555A'}
                  strokeWidth="3"
                  strokeDasharray="6 4"
                  opacity="0.8"
                />
                <line
                  x1={x(p.standPipe.chainageM)}
                  y1={y(p.intake.levelM)}
                  x2={x(p.standPipe.chainageM)}
                  y2={y(p.standPipe.levelM)}
                  stroke={PAIR_COLOURS[i] ?? '#4F555A'}
                  strokeWidth="6"
                  data-testid={`stand-pipe-${p.rank}`}
                >
                  <title>Stand pipe</title>
                </line>
                <line
                  x1={x(p.standPipe.chainageM)}
                  y1={y(p.standPipe.levelM)}
                  x2={x(p.pump.chainageM)}
                  y2={y(p.pump.levelM)}
                  stroke={PAIR_COLOURS[i] ?? '#4F555A'}
                  strokeWidth="5"
                  strokeLinecap="round"
                  opacity="0.8"
                />
              </>
            ) : (
              <line
                x1={x(p.intake.chainageM)}
                y1={y(p.intake.levelM)}
                x2={x(p.pump.chainageM)}
                y2={y(p.pump.levelM)}
                stroke={PAIR_COLOURS[i] ?? '#4F555A'}
                strokeWidth="5"
                strokeLinecap="round"
                opacity="0.8"
              />
            )}
            <circle cx={x(p.pump.chainageM)} cy={y(p.pump.levelM) + 14 + 14 * i} r="9" fill={PAIR_COLOURS[i] ?? '#4F555A'} />
            <text x={x(p.pump.chainageM)} y={y(p.pump.levelM) + 18 + 14 * i} textAnchor="middle" fontSize="11" fontWeight="bold" fill="#fff">
              {p.rank}
            </text>
          </g>
        ))}
      </svg>
      <figcaption className="text-stone">
        Level against distance along the bank; numbered lines run from intake to ram (dashed: a feed pipe to an upright stand pipe, where the drive pipe
        starts); crosses flood (no ram); the square is the tank. Span <span className="figure">{showQuantity(hi - lo, 'length', units)}</span> high,{' '}
        <span className="figure">{showQuantity(c1 - c0, 'length', units)}</span> long.
      </figcaption>
    </Card>
  );
}
