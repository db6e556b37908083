'use client';

import { createContext, useContext } from 'react';
import type { SessionUser } from '@/lib/shared/domain';

// The advisor the field frame opened as: null while the phone and the server are still being asked.
// The frame and headings draw before that; what belongs to a person waits for it.
export const FieldUserContext = createContext<SessionUser | null>(null);

/** The advisor the field book is open for (remembered on this phone or confirmed), or null while unknown. */
export function useFieldUser(): SessionUser | null {
  return useContext(FieldUserContext);
}
