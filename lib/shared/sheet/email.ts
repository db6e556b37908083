// The e-mail that carries a sheet to the farmer: one function for the message sent and its preview.

export const NOTE_MAX = 1000;

export interface SheetEmailInput {
  farmerName: string | null;
  senderName: string;
  farmName: string;
  verdictWord: string;
  summary: readonly string[];
  link: string;
  /** The sender's own words, put after the greeting; empty for none. */
  note?: string | null;
}

/** Subject and plain text of the sheet's e-mail. */
export function sheetEmail(m: SheetEmailInput): { subject: string; text: string } {
  const note = m.note?.trim();
  return {
    subject: `Your water sheet: ${m.farmName} – ${m.verdictWord}`,
    text: [
      `Hello${m.farmerName ? ` ${m.farmerName}` : ''},`,
      '',
      `${m.senderName} sends you the sheet for ${m.farmName}.`,
      '',
      ...(note ? [note, ''] : []),
      m.verdictWord,
      ...m.summary,
      '',
      `Read it, acknowledge it or ask a question here: ${m.link}`,
      'The sheet is also attached as a PDF to keep or print.',
      '',
      'This is a first check from field readings, not an engineering design.',
    ].join('\n'),
  };
}
