import type { Role } from '@/lib/shared/domain';

// The claims Fallbook keeps in the next-auth JWT and session.
declare module 'next-auth' {
  interface User {
    id: string;
    role: Role;
    organisationId: string;
    sessionVersion: number;
  }
  interface Session {
    user: { id: string; role: Role; organisationId: string; name: string; email: string; sessionVersion: number; sid?: string };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: string;
    role: Role;
    organisationId: string;
    sessionVersion: number;
    /** This session's id: signing out lists it as ended. */
    sid?: string;
  }
}
