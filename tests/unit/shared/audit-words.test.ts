import { describe, expect, it } from 'vitest';
import { describeAudit } from '@/lib/shared/audit-words';

const names: Record<string, string> = { a1: 'Tobias Kerr', a2: 'Ines Achterberg' };
const person = (id: string | null | undefined) => (id ? (names[id] ?? 'a former advisor') : 'nobody');
const say = (entity: string, action: string, changes: unknown) => describeAudit({ entity, action, changes }, person);

describe('the audit trail in plain words', () => {
  it('says what a created visit holds', () => {
    expect(say('visit', 'create', { farm: 'Brandt Hollow', advisorId: 'a1', plannedOn: '2026-12-08', status: 'scheduled' })).toEqual({
      title: 'Visit planned',
      detail: 'for Brandt Hollow, advisor Tobias Kerr, on Tue, 8 Dec 2026, state “Visit booked”',
    });
  });

  it('says what a synced record was, instead of "created"', () => {
    expect(say('point', 'created', { role: 'intake', label: 'Intake pool' }).title).toBe('Added a point on the map (Intake pool, intake)');
    expect(say('pipeRun', 'updated', { lengthM: 24, purpose: 'drive' })).toEqual({
      title: 'Changed a pipe run (drive pipe, 24 m)',
      detail: 'changed: length, purpose',
    });
    expect(say('flowMeasurement', 'deleted', null).title).toBe('Removed a flow measurement');
  });

  it('says sends, reading, decisions and questions in words, not codes', () => {
    expect(say('sheet_send', 'sheet_sent', { to: 'gwen@wenlow-water.test', paper: 'a4' })).toEqual({
      title: 'Sheet e-mailed',
      detail: 'to gwen@wenlow-water.test (A4 PDF)',
    });
    expect(say('sheet_response', 'sheet_acknowledged', {}).title).toBe('Farmer has read the sheet');
    expect(say('sheet_response', 'sheet_not_now', { reason: 'Waiting for the grant.' })).toEqual({
      title: 'Farmer said: not now',
      detail: 'reason: “Waiting for the grant.”',
    });
    expect(say('sheet_response', 'sheet_question', { text: 'How deep?' }).detail).toBe('“How deep?”');
  });

  it('reads both stored shapes of a state change, and a jump with its reason', () => {
    expect(say('visit', 'status', { before: { status: 'scheduled' }, after: { status: 'cancelled' } }).title).toBe('State: Visit booked → Cancelled');
    expect(say('visit', 'status', { from: 'scheduled', to: 'surveyed', reason: 'readings synced' })).toEqual({
      title: 'State: Visit booked → Site walked',
      detail: 'because: readings synced',
    });
    expect(say('visit', 'status_jump', { from: 'scheduled', to: 'installed', reason: 'Installed on paper.' })).toEqual({
      title: 'State moved outside the usual order: Visit booked → Ram installed',
      detail: 'Reason given: “Installed on paper.”',
    });
  });

  it('never shows a raw code for any line', () => {
    const codes = /\b(sheet_sent|sheet_question|created|updated|status_jump|acknowledged|scheduled)\b/;
    const lines: [string, string][] = [
      ['visit', 'create'],
      ['waterSource', 'created'],
      ['sheet_send', 'sheet_sent'],
      ['sheet_response', 'sheet_question'],
      ['visit', 'status_jump'],
      ['mystery', 'odd_code'],
    ];
    for (const [entity, action] of lines) {
      const words = say(entity, action, { status: 'scheduled' });
      expect(`${words.title} ${words.detail}`).not.toMatch(codes);
    }
  });
});
