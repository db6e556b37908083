// What a field page loads before it is drawn: the modules it imports statically (not `import type`,
// not `import()`), followed through the project's files. The field home and the flow and fall
// screens must not load Dexie or zod with them: the phone's database is read by the field worker,
// the outbox loads at the first save or delete, and the shared schemas at the first touch
// (DEVELOPERS.md).
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const root = path.resolve(__dirname, '../../..');

function resolveFile(from: string, specifier: string): string | null {
  const base = specifier.startsWith('@/')
    ? path.join(root, specifier.slice(2))
    : specifier.startsWith('.')
      ? path.resolve(path.dirname(from), specifier)
      : null;
  if (base === null) return null;
  for (const candidate of [base, `${base}.ts`, `${base}.tsx`, path.join(base, 'index.ts'), path.join(base, 'index.tsx')]) {
    if (existsSync(candidate) && !candidate.endsWith(path.sep) && /\.(tsx?|mjs|js)$/.test(candidate)) return candidate;
  }
  return null;
}

/** The module's static value imports (and re-exports): what runs when it is evaluated. */
function staticImports(file: string): string[] {
  const source = ts.createSourceFile(
    file,
    readFileSync(file, 'utf8'),
    ts.ScriptTarget.Latest,
    false,
    file.endsWith('x') ? ts.ScriptKind.TSX : ts.ScriptKind.TS,
  );
  const out: string[] = [];
  for (const statement of source.statements) {
    if (ts.isImportDeclaration(statement)) {
      const clause = statement.importClause;
      if (clause?.isTypeOnly) continue;
      // `import { type A, type B } from …` loads nothing either.
      const named = clause?.namedBindings;
      if (clause && !clause.name && named && ts.isNamedImports(named) && named.elements.length > 0 && named.elements.every((e) => e.isTypeOnly)) continue;
      out.push((statement.moduleSpecifier as ts.StringLiteral).text);
    } else if (ts.isExportDeclaration(statement) && statement.moduleSpecifier && !statement.isTypeOnly) {
      out.push((statement.moduleSpecifier as ts.StringLiteral).text);
    }
  }
  return out;
}

/** Every package and project file a page reaches through static imports, with the path that reached it. */
function startUpGraph(entries: string[]): Map<string, string[]> {
  const reached = new Map<string, string[]>();
  const queue = entries.map((e) => ({ file: path.join(root, e), trail: [e] }));
  while (queue.length > 0) {
    const { file, trail } = queue.shift()!;
    for (const specifier of staticImports(file)) {
      const target = resolveFile(file, specifier);
      const key = target ? path.relative(root, target) : specifier;
      if (reached.has(key)) continue;
      reached.set(key, [...trail, key]);
      if (target) queue.push({ file: target, trail: [...trail, key] });
    }
  }
  return reached;
}

const FIELD_FRAME = ['app/(field)/field/layout.tsx'];
const NOT_AT_START = (key: string) =>
  key === 'dexie' || key === 'zod' || key.startsWith('zod/') || key === 'lib/client/db.ts' || key === 'lib/client/outbox.ts';

describe('what a field page loads before it is drawn', () => {
  for (const page of ['app/(field)/field/page.tsx', 'app/(field)/field/visit/flow/page.tsx', 'app/(field)/field/visit/fall/page.tsx']) {
    it(`${page} reaches neither Dexie, the outbox nor zod through its static imports`, () => {
      const graph = startUpGraph([...FIELD_FRAME, page]);
      // The walk sees the page's own components, so it is not trivially empty.
      expect(graph.has('app/(field)/field/_components/use-field-query.ts')).toBe(true);
      const found = [...graph].filter(([key]) => NOT_AT_START(key)).map(([, trail]) => trail.join(' → '));
      expect(found).toEqual([]);
    });
  }

  it('notices a static import of the outbox (the check can fail)', () => {
    const graph = startUpGraph(['app/(field)/field/visit/pipes/page.tsx']);
    expect([...graph.keys()].filter(NOT_AT_START)).toEqual(expect.arrayContaining(['lib/client/db.ts', 'dexie']));
  });
});
