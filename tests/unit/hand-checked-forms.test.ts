import { describe, expect, it } from 'vitest';
import { questionBody } from '@/lib/shared/schemas/sheet';
import { signInSchema } from '@/lib/shared/schemas/sign-in';
import { questionProblem } from '@/lib/shared/sheet/question-rules';
import { signInProblems } from '@/lib/shared/sign-in-rules';

// The sign-in page and the sheet's reply check their fields by hand (no zod in the browser): they must
// refuse what the server's schema refuses, with its messages, and let through what it accepts.
describe('hand-checked forms agree with the server schemas', () => {
  const emails = ['maren@wenlow-water.test', '  Ines@Example.ORG ', 'no-at-sign', 'a@b', '@x.org', 'x@.', `${'a'.repeat(250)}@x.org`, ''];
  const passwords = ['fallbook-demo', '', 'x', 'p'.repeat(200), 'p'.repeat(201)];

  it('sign-in: the same fields are refused, with the schema’s messages', () => {
    for (const email of emails) {
      for (const password of passwords) {
        const parsed = signInSchema.safeParse({ email, password });
        const fieldErrors = parsed.success ? {} : parsed.error.flatten().fieldErrors;
        const problems = signInProblems(email, password);
        expect(problems.email, `${email} / ${password.length}`).toBe(fieldErrors.email?.[0]);
        expect(problems.password, `${email} / ${password.length}`).toBe(fieldErrors.password?.[0]);
      }
    }
  });

  it('sheet question: the same texts are refused, with the schema’s messages', () => {
    for (const text of ['', '  ', 'ok', 'Why?', '   Is the tank big enough?  ', 'q'.repeat(2000), 'q'.repeat(2001), ` ${'q'.repeat(2000)} `]) {
      const parsed = questionBody.safeParse({ text });
      const message = parsed.success ? null : (parsed.error.issues[0]?.message ?? null);
      expect(questionProblem(text), JSON.stringify(text.slice(0, 20))).toBe(message);
    }
  });
});
