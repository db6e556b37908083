import type { CommissioningPoint } from '@/lib/server/data/commissioning';
import type { UnitSystem } from '@/lib/shared/domain';
import { formatFigure } from '@/lib/shared/display/numbers';
import { QUANTITIES } from '@/lib/shared/display/quantities';

const W = 640;
const H = 440;
const PAD = { left: 80, right: 20, top: 20, bottom: 60 };

/** Scatter of predicted (x) against measured (y) daily delivery, with the 10–90 % band of each screening and the 1:1 line. */
export function PredictedMeasuredPlot({ points, units }: { points: CommissioningPoint[]; units: UnitSystem }) {
  const shown = points.filter((p): p is CommissioningPoint & { predictedLpd: number } => p.predictedLpd !== null);
  const d = QUANTITIES.litresPerDay[units];
  const max = Math.max(1, ...shown.flatMap((p) => [p.predictedLpd, p.measuredLpd, p.p90Lpd ?? 0])) * 1.1;
  const x = (v: number) => PAD.left + (v / max) * (W - PAD.left - PAD.right);
  const y = (v: number) => H - PAD.bottom - (v / max) * (H - PAD.top - PAD.bottom);
  const ticks = [0, 0.25, 0.5, 0.75, 1].map((f) => f * max);
  const label = (v: number) => formatFigure(d.fromSi(v));
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-labelledby="pm-title" className="w-full max-w-3xl bg-white">
      <title id="pm-title">
        Predicted against measured delivery, {d.unit}, for {shown.length} commissioned rams
      </title>
      {ticks.map((t) => (
        <g key={t} className="text-stone" fill="currentColor">
          <line x1={x(0)} x2={x(max)} y1={y(t)} y2={y(t)} stroke="#C9C4B6" />
          <text x={PAD.left - 8} y={y(t) + 5} textAnchor="end" fontSize="13" className="font-mono">
            {label(t)}
          </text>
          <text x={x(t)} y={H - PAD.bottom + 20} textAnchor="middle" fontSize="13" className="font-mono">
            {label(t)}
          </text>
        </g>
      ))}
      <line x1={x(0)} y1={y(0)} x2={x(max)} y2={y(max)} stroke="#1E3A4C" strokeDasharray="6 4" />
      <text x={x(max * 0.97)} y={y(max * 0.97) + 18} textAnchor="end" fontSize="13" fill="#1E3A4C">
        as predicted
      </text>
      <text x={(x(0) + x(max)) / 2} y={H - 12} textAnchor="middle" fontSize="14" fill="#15191C">
        Predicted by the screening, {d.unit}
      </text>
      <text transform={`translate(18 ${(y(0) + y(max)) / 2}) rotate(-90)`} textAnchor="middle" fontSize="14" fill="#15191C">
        Measured at the tank, {d.unit}
      </text>
      {shown.map((p) => {
        const below = p.p10Lpd !== null && p.measuredLpd < p.p10Lpd;
        return (
          <g key={p.id}>
            {p.p10Lpd !== null && p.p90Lpd !== null && (
              <line x1={x(p.p10Lpd)} x2={x(p.p90Lpd)} y1={y(p.measuredLpd)} y2={y(p.measuredLpd)} stroke="#4F555A" strokeWidth="2" />
            )}
            {below ? (
              // Short of the band: a triangle pointing down, in clay (shape and colour both say it).
              <path d={`M ${x(p.predictedLpd) - 7} ${y(p.measuredLpd) - 6} h 14 l -7 12 z`} fill="#8C2F10" />
            ) : (
              <circle cx={x(p.predictedLpd)} cy={y(p.measuredLpd)} r="6" fill="#3E5B1E" />
            )}
            <title>{`${p.farmName}: predicted ${label(p.predictedLpd)}, measured ${label(p.measuredLpd)} ${d.unit}`}</title>
          </g>
        );
      })}
    </svg>
  );
}
