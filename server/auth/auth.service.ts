import { randomUUID } from 'node:crypto';
import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import type {
  ChangePasswordInput,
  Me,
  ResetConfirmInput,
  SignInInput,
  SignUpInput,
  UpdateMeInput,
} from '../../shared/schemas/auth';
import type { Role } from '../../shared/schemas/common';
import type { Config } from '../config';
import {
  BadRequestError,
  ConflictError,
  NotFoundError,
  UnauthenticatedError,
} from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { isDuplicateKey } from '../db/duplicate-key';
import { resetMail } from '../mail/templates';
import { Membership } from '../teams/membership.entity';
import { Team } from '../teams/team.entity';
import { iso } from '../util';
import { createLucia } from './lucia';
import { decoyHash, hashPassword, verifyPassword } from './password';
import { PasswordReset } from './password-reset.entity';
import { hashToken, newToken } from './tokens';
import { User } from './user.entity';

const RESET_TTL_MS = 60 * 60 * 1000;
const WRONG_CREDENTIALS = 'E-mail or password is wrong.';
const emailTaken = () =>
  new ConflictError(
    'An account with this e-mail already exists. Sign in or reset the password.',
    'email_taken',
  );

export class AuthService {
  readonly lucia;

  constructor(
    private readonly ds: DataSource,
    private readonly config: Pick<Config, 'publicUrl'>,
    private readonly mailer: Mailer,
  ) {
    this.lucia = createLucia(ds);
  }

  private get users() {
    return this.ds.getRepository(User);
  }

  /**
   * Creates the account; returns the new user's id. `join` runs in the same transaction before
   * the account is written (spending an invite), so a spent or withdrawn invite leaves no account
   * behind and a refused account leaves the invite open. Two sign-ups racing for one address:
   * the unique e-mail lets one win, the other answers 409.
   */
  async signUp(
    input: SignUpInput,
    join?: (em: EntityManager, userId: string) => Promise<void>,
  ): Promise<string> {
    const existing = await this.users.findOneBy({ email: input.email });
    if (existing) throw emailTaken();
    const id = randomUUID();
    const passwordHash = await hashPassword(input.password);
    try {
      await this.ds.transaction(async (em) => {
        await em.getRepository(User).insert({
          id,
          email: input.email,
          name: input.name,
          passwordHash,
          commentMail: true,
          createdAt: Date.now(),
        });
        await join?.(em, id);
      });
    } catch (err) {
      if (isDuplicateKey(err)) throw emailTaken();
      throw err;
    }
    return id;
  }

  /** Same answer and about the same time for an unknown e-mail and a wrong password. */
  async signIn(input: SignInInput): Promise<string> {
    const user = await this.users.findOneBy({ email: input.email });
    if (!user) {
      await verifyPassword(await decoyHash(), input.password);
      throw new UnauthenticatedError(WRONG_CREDENTIALS);
    }
    if (!(await verifyPassword(user.passwordHash, input.password)))
      throw new UnauthenticatedError(WRONG_CREDENTIALS);
    return user.id;
  }

  async createSession(userId: string): Promise<string> {
    return (await this.lucia.createSession(userId, {})).id;
  }

  async me(userId: string): Promise<Me> {
    const user = await this.users.findOneBy({ id: userId });
    if (!user) throw new NotFoundError('User');
    const teams = await this.ds
      .getRepository(Membership)
      .createQueryBuilder('m')
      .innerJoin(Team, 't', 't.id = m.teamId')
      .select(['t.id AS id', 't.name AS name', 'm.role AS role'])
      .where('m.userId = :userId', { userId })
      .orderBy('t.name')
      .getRawMany<{ id: string; name: string; role: Role }>();
    return {
      id: user.id,
      email: user.email,
      name: user.name,
      commentMail: Boolean(user.commentMail),
      createdAt: iso(user.createdAt),
      teams,
    };
  }

  async updateMe(userId: string, input: UpdateMeInput): Promise<Me> {
    await this.users.update({ id: userId }, input);
    return this.me(userId);
  }

  /** Mails a one-time link when the account exists; says nothing either way. */
  async requestReset(email: string): Promise<void> {
    const user = await this.users.findOneBy({ email });
    if (!user) return;
    const token = newToken();
    const expiresAt = Date.now() + RESET_TTL_MS;
    await this.ds.getRepository(PasswordReset).insert({
      id: randomUUID(),
      userId: user.id,
      tokenHash: hashToken(token),
      expiresAt,
      usedAt: null,
      createdAt: Date.now(),
    });
    this.mailer.queue(
      resetMail(this.config, {
        to: user.email,
        name: user.name,
        token,
        expiresAt: new Date(expiresAt),
      }),
    );
  }

  /** Sets the new password, spends the token and signs out every session. Returns the user id. */
  async confirmReset(input: ResetConfirmInput): Promise<string> {
    const resets = this.ds.getRepository(PasswordReset);
    const reset = await resets.findOneBy({ tokenHash: hashToken(input.token) });
    if (!reset || reset.usedAt !== null || reset.expiresAt <= Date.now()) {
      throw new BadRequestError(
        'This reset link is invalid, used or expired. Ask for a new one.',
        'invalid_token',
      );
    }
    // Spend the token first so two racing confirmations cannot both win.
    const spent = await resets.update({ id: reset.id, usedAt: IsNull() }, { usedAt: Date.now() });
    if (!spent.affected)
      throw new BadRequestError(
        'This reset link is invalid, used or expired. Ask for a new one.',
        'invalid_token',
      );
    await this.users.update(
      { id: reset.userId },
      { passwordHash: await hashPassword(input.password) },
    );
    await this.endResetLinks(reset.userId);
    await this.lucia.invalidateUserSessions(reset.userId);
    return reset.userId;
  }

  /** Checks the current password, sets the new one and ends every session of the user. */
  async changePassword(userId: string, input: ChangePasswordInput): Promise<void> {
    const user = await this.users.findOneBy({ id: userId });
    if (!user) throw new NotFoundError('User');
    if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
      throw new BadRequestError('The current password is wrong.', 'wrong_password');
    }
    await this.users.update(
      { id: userId },
      { passwordHash: await hashPassword(input.newPassword) },
    );
    await this.endResetLinks(userId);
    await this.lucia.invalidateUserSessions(userId);
  }

  /**
   * Spends every unused reset link of the user: once the password is set anew, an older link
   * (perhaps in a mailbox someone else can read) must not set it again.
   */
  private async endResetLinks(userId: string): Promise<void> {
    await this.ds
      .getRepository(PasswordReset)
      .update({ userId, usedAt: IsNull() }, { usedAt: Date.now() });
  }

  async signOut(sessionId: string): Promise<void> {
    await this.lucia.invalidateSession(sessionId);
  }
}
