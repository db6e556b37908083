/**
 * A drawing's box, sized exactly by its width and the drawing's proportions, whose inside is drawn
 * only when the reader scrolls near it (content-visibility): the sheet's drawings were much of the
 * first layout a phone ran to show it. The box is the drawing's own size, so nothing around it moves
 * or overlaps when it is drawn; paper draws it at once.
 */
export function Deferred({ width, height, html, className = '' }: { width: number; height: number; html: string; className?: string }) {
  return (
    <div
      className={`[content-visibility:auto] print:[content-visibility:visible] ${className}`}
      style={{ aspectRatio: `${width} / ${height}` }}
      dangerouslySetInnerHTML={{ __html: html }}
    />
  );
}
