import { LABEL_SIZE, NOTE_SIZE, nodeLabelAt, profileLabelAt, type ProfileGeometry } from '@/lib/shared/sheet/profile';

function ProfileSvg({ g, className }: { g: ProfileGeometry; className: string }) {
  return (
    <svg viewBox={`0 0 ${g.width} ${g.height}`} className={`h-auto w-full bg-white ${className}`} role="img" aria-label={g.description}
      data-testid="profile-drawing">
      {g.yGrid.map((l) => (
        <g key={`y${l.at}`}>
          <line x1={g.plot.x} x2={g.plot.x + g.plot.w} y1={l.at} y2={l.at} stroke="#C9C4B6" strokeWidth={0.8} />
          <text x={g.plot.x - 6} y={l.at + 4} textAnchor="end" fontSize={NOTE_SIZE} fill="#4F555A">{l.label}</text>
        </g>
      ))}
      {g.xGrid.map((l, i) => (
        <g key={`x${l.at}`}>
          <line x1={l.at} x2={l.at} y1={g.plot.y} y2={g.plot.y + g.plot.h} stroke="#C9C4B6" strokeWidth={0.8} />
          {/* The last distance label ends at its line so it stays inside the frame. */}
          <text x={l.at} y={g.plot.y + g.plot.h + 16} textAnchor={i === g.xGrid.length - 1 && l.at > g.width - 40 ? 'end' : 'middle'} fontSize={NOTE_SIZE} fill="#4F555A">{l.label}</text>
        </g>
      ))}
      {g.pipes.map((p) => (
        <line key={p.key} x1={p.x1} y1={p.y1} x2={p.x2} y2={p.y2} stroke="#184F69" strokeWidth={4}
          strokeDasharray={p.key === 'delivery' ? '10 4' : undefined} />
      ))}
      {g.pipes.map((p) => {
        const at = profileLabelAt(g, p);
        return <text key={`l${p.key}`} x={at.anchor === 'end' ? at.x + at.width : at.x} y={at.y + 11} textAnchor={at.anchor} fontSize={LABEL_SIZE} fontWeight={700} fill="#15191C">{p.label}</text>;
      })}
      {g.nodes.map((n) => {
        const at = nodeLabelAt(g, n);
        const x = at.anchor === 'end' ? at.x + at.width : at.x;
        return (
          <g key={n.key} data-node={n.key}>
            {n.key === 'tank' && <rect x={n.x - 14} y={n.y - 20} width={16} height={20} fill="#fff" stroke="#15191C" strokeWidth={2} />}
            {n.key === 'pump' && <rect x={n.x - 7} y={n.y - 7} width={14} height={14} fill="#15191C" />}
            {n.key === 'intake' && <circle cx={n.x} cy={n.y} r={6} fill="#fff" stroke="#15191C" strokeWidth={2} />}
            <text x={x} y={at.y + 11} textAnchor={at.anchor} fontSize={LABEL_SIZE} fontWeight={700} fill="#15191C">{n.label}</text>
            <text x={x} y={at.y + 25} textAnchor={at.anchor} fontSize={NOTE_SIZE} fill="#4F555A">{n.height}</text>
          </g>
        );
      })}
    </svg>
  );
}

/**
 * The elevation profile as inline SVG, from the same geometry the PDF draws: a narrow drawing on a
 * phone and a wide one from 640 px up, each fitting its box, so nothing needs scrolling sideways.
 */
export function ProfileDrawing({ g, narrow }: { g: ProfileGeometry; narrow: ProfileGeometry | null }) {
  return (
    <figure className="space-y-2">
      {narrow ? (
        <>
          <ProfileSvg g={narrow} className="sm:hidden print:hidden" />
          <ProfileSvg g={g} className="hidden sm:block print:block" />
        </>
      ) : (
        <ProfileSvg g={g} className="" />
      )}
      <figcaption className="text-stone">
        {[g.exaggeration, 'Drive pipe solid, delivery pipe dashed.'].filter(Boolean).join('. ')}
      </figcaption>
    </figure>
  );
}
