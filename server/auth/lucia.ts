import { Lucia, TimeSpan } from 'lucia';
import type { DataSource } from 'typeorm';
import { TypeOrmLuciaAdapter } from './lucia-adapter';

export function createLucia(dataSource: DataSource) {
  return new Lucia(new TypeOrmLuciaAdapter(dataSource), {
    sessionExpiresIn: new TimeSpan(30, 'd'),
    sessionCookie: {
      name: 'hp_session',
      // `secure` is decided per request (HTTPS or not), see http/session.ts.
      attributes: { sameSite: 'lax', secure: false },
    },
    getUserAttributes: (a) => ({ email: a.email, name: a.name, commentMail: a.commentMail }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: { email: string; name: string; commentMail: boolean };
  }
}
