import { VERDICT_COLOURS, VERDICT_WORDS, type Verdict } from '@/lib/shared/domain';

/**
 * The verdict as word + shape + colour (never colour alone): a level vial whose bubble sits
 * between the marks for go, off to one side for conditional, a struck-through vial for no-go,
 * and a running-water wave along it for gravity (no pump needed).
 */
export function VerdictMark({ verdict, size = 28 }: { verdict: Verdict; size?: number }) {
  const colour = VERDICT_COLOURS[verdict];
  const bubbleX = verdict === 'conditional' ? 36 : 24;
  return (
    <span className="inline-flex items-center gap-2 font-bold" style={{ color: colour }}>
      <svg width={size * 1.7} height={size} viewBox="0 0 48 28" aria-hidden="true" focusable="false">
        <rect x="2" y="6" width="44" height="16" rx="8" fill="none" stroke={colour} strokeWidth="2.5" />
        <line x1="18" y1="6" x2="18" y2="22" stroke={colour} strokeWidth="2" />
        <line x1="30" y1="6" x2="30" y2="22" stroke={colour} strokeWidth="2" />
        {verdict === 'no-go' ? (
          <line x1="4" y1="26" x2="44" y2="2" stroke={colour} strokeWidth="3.5" strokeLinecap="round" />
        ) : verdict === 'gravity' ? (
          <path d="M6 14 Q12 8 18 14 Q24 20 30 14 Q36 8 42 14" fill="none" stroke={colour} strokeWidth="3" strokeLinecap="round" />
        ) : (
          <ellipse cx={bubbleX} cy="14" rx="5" ry="4" fill={colour} />
        )}
      </svg>
      <span>{VERDICT_WORDS[verdict]}</span>
    </span>
  );
}
