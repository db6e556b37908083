import { profileSvg } from '@/lib/shared/sheet/drawing-svg';
import type { ProfileGeometry } from '@/lib/shared/sheet/profile';
import { Deferred } from './deferred-drawing';

/**
 * The elevation profile: the same SVG markup the PDF draws (every label escaped in drawing-svg.ts).
 * A narrow layout on a phone and the wide one from 640 px up, each fitting its box, so nothing
 * needs scrolling sideways.
 */
export function ProfileDrawing({ g, narrow }: { g: ProfileGeometry; narrow: ProfileGeometry | null }) {
  const wide = profileSvg(g, { testId: 'profile-drawing' });
  return (
    <figure className="space-y-2">
      {narrow ? (
        <>
          <Deferred width={narrow.width} height={narrow.height} className="sm:hidden print:hidden" html={profileSvg(narrow, { testId: 'profile-drawing' })} />
          <Deferred width={g.width} height={g.height} className="hidden sm:block print:block" html={wide} />
        </>
      ) : (
        <Deferred width={g.width} height={g.height} html={wide} />
      )}
      <figcaption className="text-stone">{[g.exaggeration, g.legend].filter(Boolean).join('. ')}</figcaption>
    </figure>
  );
}
