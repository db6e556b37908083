// The app's class merger knows only the kinds of class the app uses (components/ui/cn.ts). Checked
// against tailwind-merge's full default merger on every class written in the source.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { createTailwindMerge, getDefaultConfig, twMerge } from 'tailwind-merge';
import { describe, expect, it } from 'vitest';
import { CLASS_GROUPS, cn } from '@/components/ui/cn';

const root = path.resolve(__dirname, '../../..');

/** Every word of every string literal in the app's source that the full merger takes for a Tailwind class. */
function sourceClasses(): string[] {
  const words = new Set<string>();
  for (const dir of ['app', 'components', 'lib']) {
    for (const file of readdirSync(path.join(root, dir), { recursive: true }) as string[]) {
      if (!/\.tsx?$/.test(file)) continue;
      const source = readFileSync(path.join(root, dir, file), 'utf8');
      for (const literal of source.matchAll(/(["'`])((?:(?!\1).)*)\1/g))
        for (const word of (literal[2] ?? '').split(/\s+/)) if (/^[!a-z0-9:[\]\-/.%#_()]+$/i.test(word) && word.length < 60) words.add(word);
    }
  }
  // A class the full merger recognises collapses with itself; other words stay doubled. Arbitrary
  // properties ("[content-visibility:auto]") belong to no kind and merge by their property.
  return [...words].filter((w) => twMerge(`${w} ${w}`) === w && !/(^|:)\[/.test(w)).sort();
}

describe('the class merger', () => {
  const classes = sourceClasses();

  it('reads a few hundred classes from the source', () => {
    expect(classes.length).toBeGreaterThan(200);
    expect(classes).toContain('min-h-12');
    expect(classes).toContain('text-slate');
  });

  it('knows the kind of every class in the source', () => {
    const config = getDefaultConfig();
    const missing: string[] = [];
    for (const group of Object.keys(config.classGroups)) {
      if (CLASS_GROUPS.has(group)) continue;
      // A merger of this kind alone: a class of it collapses with itself.
      const alone = createTailwindMerge(() => ({
        ...config,
        classGroups: { [group]: config.classGroups[group as keyof typeof config.classGroups] } as typeof config.classGroups,
        conflictingClassGroups: {},
        conflictingClassGroupModifiers: {},
      }));
      const taken = classes.filter((c) => alone(`${c} ${c}`) === c);
      // Loose kinds take any word after their prefix; they matter only if a pair merges differently (below).
      if (taken.length > 0 && taken.some((c) => classes.some((d) => cn(c, d) !== twMerge(`${c} ${d}`)))) missing.push(`${group}: ${taken.join(' ')}`);
    }
    expect(missing).toEqual([]);
  });

  it('merges every pair of source classes as the full merger does', () => {
    const differ: string[] = [];
    for (const a of classes) for (const b of classes) if (cn(a, b) !== twMerge(`${a} ${b}`)) differ.push(`${a} ${b}`);
    expect(differ.slice(0, 20)).toEqual([]);
    expect(classes.length ** 2).toBeGreaterThan(40_000);
  });

  it('lets the later class of a kind win, as the primitives rely on', () => {
    expect(cn('min-h-12 rounded-md font-bold', 'px-4', 'min-h-14 text-xl')).toBe('rounded-md font-bold px-4 min-h-14 text-xl');
    expect(cn('border-2 border-slate text-slate', 'text-clay')).toBe('border-2 border-slate text-clay');
    expect(cn('bg-white', false, undefined, 'bg-paper')).toBe('bg-paper');
  });
});
