import { MAP_LABEL_SIZE, type SiteMapGeometry } from '@/lib/shared/sheet/site-map';

/** The surveyed points on a plain north-up drawing with a scale bar (no map tiles needed). */
export function SiteMapDrawing({ g }: { g: SiteMapGeometry }) {
  const b = g.scaleBar;
  return (
    <svg viewBox={`0 0 ${g.width} ${g.height}`} className="h-auto w-full max-w-sm border border-rule bg-white" role="img" aria-label={g.description}
      data-testid="site-map-drawing">
      {g.route.length > 1 && <polyline points={g.route.map((p) => `${p.x},${p.y}`).join(' ')} fill="none" stroke="#184F69" strokeWidth={2.5} />}
      {g.points.map((p) => (
        <g key={`${p.role}${p.x}`}>
          <circle cx={p.x} cy={p.y} r={5} fill="#fff" stroke="#15191C" strokeWidth={1.5} />
          <text x={p.labelX} y={p.labelY} textAnchor={p.anchor} fontSize={MAP_LABEL_SIZE} fill="#15191C">{p.label}</text>
        </g>
      ))}
      <path d={`M${b.x} ${b.y - 4}v8M${b.x} ${b.y}h${b.length}M${b.x + b.length} ${b.y - 4}v8`} stroke="#15191C" strokeWidth={2} fill="none" />
      <text x={b.x + b.length + 6} y={b.y + 4} fontSize={MAP_LABEL_SIZE} fill="#15191C">{b.label}</text>
      <path d={`M${g.width - 20} 12l-6 16h12z`} fill="#15191C" />
      <text x={g.width - 24} y={42} fontSize={MAP_LABEL_SIZE} fontWeight={700} fill="#15191C">N</text>
    </svg>
  );
}
