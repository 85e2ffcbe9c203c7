import type { DefaultSession } from 'next-auth';
import type { Role } from '@/models/user';

declare module 'next-auth' {
  interface Session {
    user: DefaultSession['user'] & { id: number; role: Role; units: 'si' | 'us' };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid?: number;
    role?: Role;
    units?: 'si' | 'us';
    /** The server-side session row (user_sessions.id). */
    sid?: string;
    /** The person's session version at sign-in. */
    sv?: number;
    /** Sign-in time in seconds: the absolute lifetime counts from here. */
    sat?: number;
  }
}
