// GET /api/questions – farmers' questions still waiting for an answer: the organisation's (coordinators), the caller's visits' (advisors).
import { listOpenQuestions } from '@/lib/server/data/sheet-responses';
import { withAuth } from '@/lib/server/http/with-auth';

export const GET = withAuth('sheet:answer', async ({ user }) => Response.json({ questions: await listOpenQuestions(user) }));
