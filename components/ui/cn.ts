import { clsx, type ClassValue } from 'clsx';
import { createTailwindMerge, getDefaultConfig } from 'tailwind-merge';

/**
 * The kinds of Tailwind class (tailwind-merge's group names) this app's own classes come in. The
 * merger knows only these: building its lookup for all of Tailwind's 380 kinds is a task of 50 to
 * 100 ms on a mid-range phone's first drawn button. A unit test (tests/unit/components/cn.test.ts)
 * holds the merge of every pair of classes written in the app's source to the full merger's, and
 * names the kind of a class that is missing here.
 */
// prettier-ignore
export const CLASS_GROUPS: ReadonlySet<string> = new Set([
  'break-inside', 'display', 'sr', 'object-fit', 'overflow-x', 'flex-direction', 'flex-wrap', 'flex', 'shrink', 'grid-cols',
  'col-start-end', 'gap', 'gap-x', 'gap-y', 'justify-content', 'align-items', 'p', 'px', 'py', 'pt', 'pr', 'pb', 'pl', 'mx',
  'mt', 'mb', 'ml', 'space-y', 'w', 'min-w', 'max-w', 'h', 'min-h', 'font-size', 'font-weight', 'font-family',
  'font-smoothing', 'font-style', 'leading', 'line-clamp', 'list-style-type', 'text-alignment', 'text-color',
  'text-decoration', 'text-decoration-color', 'underline-offset', 'text-transform', 'vertical-align', 'whitespace',
  'break', 'wrap', 'bg-color', 'gradient-from', 'rounded', 'border-w', 'border-w-y', 'border-w-t', 'border-w-b',
  'border-w-l', 'divide-y', 'border-color', 'border-color-t', 'border-color-b', 'border-color-l', 'divide-color',
  'opacity', 'filter', 'transition', 'border-collapse', 'table-layout', 'cursor', 'scroll-mt', 'position', 'inset-x',
  'bottom', 'visibility', 'z',
]);

const only = <V>(record: Record<string, V>): Record<string, V> => Object.fromEntries(Object.entries(record).filter(([group]) => CLASS_GROUPS.has(group)));

// The default configuration with only the groups above, in their order (which decides a class's
// kind where two would take it), and only the conflicts between them.
const twMerge = createTailwindMerge(() => {
  const config = getDefaultConfig();
  const conflicts = only(config.conflictingClassGroups as Record<string, readonly string[]>);
  return {
    ...config,
    classGroups: only(config.classGroups) as typeof config.classGroups,
    conflictingClassGroups: Object.fromEntries(
      Object.entries(conflicts).map(([group, list]) => [group, list.filter((g) => CLASS_GROUPS.has(g))]),
    ) as unknown as typeof config.conflictingClassGroups,
    conflictingClassGroupModifiers: only(
      config.conflictingClassGroupModifiers as Record<string, readonly string[]>,
    ) as typeof config.conflictingClassGroupModifiers,
  };
});

/** Joins class names; a later Tailwind class wins over an earlier one of the same kind (`px-3` over `px-4`). */
export function cn(...inputs: ClassValue[]): string {
  return twMerge(clsx(inputs));
}
