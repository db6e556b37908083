import { profileSvg } from '@/lib/shared/sheet/drawing-svg';
import type { ProfileGeometry } from '@/lib/shared/sheet/profile';

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
          <div className="sm:hidden print:hidden" dangerouslySetInnerHTML={{ __html: profileSvg(narrow, { testId: 'profile-drawing' }) }} />
          <div className="hidden sm:block print:block" dangerouslySetInnerHTML={{ __html: wide }} />
        </>
      ) : (
        <div dangerouslySetInnerHTML={{ __html: wide }} />
      )}
      <figcaption className="text-stone">{[g.exaggeration, g.legend].filter(Boolean).join('. ')}</figcaption>
    </figure>
  );
}
