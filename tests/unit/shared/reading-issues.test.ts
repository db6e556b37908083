import { describe, expect, it } from 'vitest';
import { readingIssues } from '@/lib/shared/reading-issues';
import { siteReadingsSchema } from '@/lib/shared/schemas/site-readings';
import { clearGo } from '../engine/fixtures/demo-sites';

function issuesOf(patch: Record<string, unknown>) {
  const parsed = siteReadingsSchema.safeParse({ ...structuredClone(clearGo), ...patch });
  expect(parsed.success).toBe(false);
  return parsed.success ? [] : readingIssues(parsed.error.issues);
}

describe('what the preview says is still needed', () => {
  it('a visit with no delivery pipe yet names the record and its page, never zod\u2019s "expected object, received undefined"', () => {
    const issues = issuesOf({ deliveryPipe: undefined });
    expect(issues).toEqual([{ record: 'Delivery pipe', page: 'pipes', message: 'Measure the delivery pipe from the ram to the tank.' }]);
  });

  it('names which measurement or run to fix, counting from 1, with the schema\u2019s plain sentence', () => {
    const issues = issuesOf({
      flowMeasurements: [clearGo.flowMeasurements[0], { method: 'volumetric', season: 'dry', trials: [{ volumeL: -20, seconds: 10 }] }],
      fallRuns: [{ method: 'clinometer', legs: [{ slopeDistanceM: 10, angleBelowHorizontalDeg: 95 }] }],
    });
    expect(issues).toContainEqual({ record: 'Flow measurement 2', page: 'flow', message: 'Bucket volume must be more than 0' });
    expect(issues).toContainEqual({ record: 'Fall run 1', page: 'fall', message: 'Angle must be at most 89' });
  });

  it('never shows a schema path or code', () => {
    const issues = issuesOf({ deliveryPipe: undefined, lift: undefined, demand: [] });
    for (const i of issues) expect(`${i.record} ${i.message}`).not.toMatch(/\.\d|Invalid input|expected|received|[a-z][A-Z]/);
  });
});
