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
  }
}
