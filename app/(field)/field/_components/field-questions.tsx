'use client';

import { useEffect, useState } from 'react';
import { OpenQuestions } from '@/components/open-questions';
import type { OpenQuestion } from '@/lib/shared/conversation';

/**
 * Farmers' questions on this advisor's visits that wait for an answer. They live on the server (the
 * answer is given on the sheet, online), so they are asked for when the phone has a signal and not
 * kept on the phone; offline the home says so instead of showing an old list. They are asked for at
 * once but drawn only when `shown` (the home's list has settled above them).
 */
export function FieldQuestions({ enabled, shown }: { enabled: boolean; shown: boolean }) {
  const [questions, setQuestions] = useState<OpenQuestion[] | null>(null);
  const [offline, setOffline] = useState(false);
  useEffect(() => {
    if (!enabled) return;
    let live = true;
    const load = () => {
      fetch('/api/questions', { headers: { accept: 'application/json' } })
        .then((res) => (res.ok ? res.json() : Promise.reject(new Error(String(res.status)))))
        .then((body: { questions: OpenQuestion[] }) => {
          if (live) {
            setQuestions(body.questions);
            setOffline(false);
          }
        })
        .catch(() => {
          if (live) setOffline(true);
        });
    };
    load();
    window.addEventListener('online', load);
    return () => {
      live = false;
      window.removeEventListener('online', load);
    };
  }, [enabled]);
  if (!shown) return null;
  if (offline && questions === null) return <p className="text-stone">Farmers’ questions show here when the phone has a signal.</p>;
  if (questions === null) return null;
  return <OpenQuestions questions={questions} empty="No farmer’s question is waiting for you." />;
}
