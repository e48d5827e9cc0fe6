import type { DataSource } from 'typeorm';
import {
  CommentPatch,
  CommentPutInput,
  type Comment as CommentDto,
} from '../../shared/schemas/comments';
import type { Role, UserRef } from '../../shared/schemas/common';
import { User } from '../auth/user.entity';
import type { Config } from '../config';
import { Aircraft } from '../aircraft/aircraft.entity';
import { Flight } from '../flights/flight.entity';
import type { FlightsService } from '../flights/flights.service';
import { BadRequestError, ConflictError, ForbiddenError, NotFoundError } from '../http/errors';
import type { MailQuota } from '../mail/mail-quota';
import type { Mailer } from '../mail/mailer';
import { commentMail, type CommentMailKind } from '../mail/templates';
import { Membership } from '../teams/membership.entity';
import { assertCan } from '../teams/permissions';
import { can, canOnRecord } from '../../shared/auth/permissions';
import { iso, isoOrNull } from '../util';
import { isDuplicateKey } from '../db/duplicate-key';
import { VersionConflictError } from '../http/versions';
import { Comment } from './comment.entity';
import { commentInserter } from './comment-insert';

export class CommentsService {
  constructor(
    private readonly ds: DataSource,
    private readonly config: Pick<Config, 'publicUrl'>,
    private readonly flights: FlightsService,
    private readonly mailer: Mailer,
    private readonly mentionQuota: MailQuota,
  ) {}

  private get repo() {
    return this.ds.getRepository(Comment);
  }

  private readonly insertComment = commentInserter(this.ds);

  private async names(ids: Iterable<string>): Promise<Map<string, string>> {
    const unique = [...new Set(ids)];
    if (unique.length === 0) return new Map();
    const rows = await this.ds
      .getRepository(User)
      .createQueryBuilder('u')
      .select(['u.id AS id', 'u.name AS name'])
      .where('u.id IN (:...unique)', { unique })
      .getRawMany<{ id: string; name: string }>();
    return new Map(rows.map((r) => [r.id, r.name]));
  }

  private toDto(c: Comment, names: Map<string, string>): CommentDto {
    const ref = (id: string): UserRef => ({ id, name: names.get(id) ?? 'former member' });
    const deleted = c.deletedAt !== null;
    return {
      id: c.id,
      flightId: c.flightId,
      parentId: c.parentId,
      tS: c.tS,
      channel: c.channel,
      body: deleted ? '' : c.body,
      deleted,
      author: ref(c.authorId),
      mentions: deleted ? [] : c.mentions.map(ref),
      resolvedAt: isoOrNull(c.resolvedAt),
      resolvedBy: c.resolvedById ? ref(c.resolvedById) : null,
      editedAt: isoOrNull(c.editedAt),
      createdAt: iso(c.createdAt),
      version: c.version,
    };
  }

  private async dto(c: Comment): Promise<CommentDto> {
    const ids = [c.authorId, ...c.mentions, ...(c.resolvedById ? [c.resolvedById] : [])];
    return this.toDto(c, await this.names(ids));
  }

  async list(userId: string, flightId: string): Promise<CommentDto[]> {
    await this.flights.access(userId, flightId, 'team.read');
    const rows = await this.repo.find({
      where: { flightId },
      order: { tS: 'ASC', createdAt: 'ASC' },
    });
    const names = await this.names(
      rows.flatMap((c) => [c.authorId, ...c.mentions, ...(c.resolvedById ? [c.resolvedById] : [])]),
    );
    return rows.map((c) => this.toDto(c, names));
  }

  /** Mentions must be members of the flight's team. */
  private async checkMentions(teamId: string, mentions: string[]): Promise<string[]> {
    const unique = [...new Set(mentions)];
    if (unique.length === 0) return [];
    const found = await this.ds
      .getRepository(Membership)
      .createQueryBuilder('m')
      .where('m.teamId = :teamId AND m.userId IN (:...unique)', { teamId, unique })
      .getCount();
    if (found !== unique.length)
      throw new BadRequestError('Only members of this team can be mentioned.');
    return unique;
  }

  /** Comment counters on the flight, recomputed (so a retried write cannot drift them). */
  private async refreshCounts(flightId: string) {
    await this.ds
      .createQueryBuilder()
      .update(Flight)
      .set({
        commentCount: () =>
          '(SELECT COUNT(*) FROM comments c WHERE c."flightId" = :fid AND c."deletedAt" IS NULL)',
        openComments: () =>
          '(SELECT COUNT(*) FROM comments c WHERE c."flightId" = :fid AND c."parentId" IS NULL AND c."resolvedAt" IS NULL AND c."deletedAt" IS NULL)',
      })
      .where('id = :fid', { fid: flightId })
      .execute();
  }

  /**
   * Creates the comment under the client's UUID. A retry of the same comment by the same author
   * answers with the stored one (created: false) and changes nothing.
   */
  async put(
    userId: string,
    id: string,
    body: CommentPutInput,
  ): Promise<{ comment: CommentDto; created: boolean }> {
    const input = CommentPutInput.parse(body);
    const flight = await this.flights.access(userId, input.flightId, 'comments.create');
    let parentId: string | null = null;
    let parent: Comment | null = null;
    if (input.parentId) {
      parent = await this.repo.findOneBy({ id: input.parentId, flightId: input.flightId });
      if (!parent) throw new BadRequestError('The comment you reply to is not on this flight.');
      // Threads are one level deep: a reply to a reply joins the same thread.
      parentId = parent.parentId ?? parent.id;
    }
    const mentions = await this.checkMentions(flight.teamId, input.mentions);
    const comment: Comment = {
      id,
      flightId: input.flightId,
      authorId: userId,
      parentId,
      tS: input.tS,
      channel: input.channel ?? null,
      body: input.body,
      mentions,
      resolvedAt: null,
      resolvedById: null,
      editedAt: null,
      deletedAt: null,
      createdAt: Date.now(),
      version: 1,
    };
    // Insert first and treat a key clash as the retry it almost always is: one query fewer on
    // the path every comment takes.
    try {
      await this.insertComment(comment);
    } catch (err) {
      if (!isDuplicateKey(err)) throw err;
      const existing = await this.repo.findOneBy({ id });
      if (!existing || existing.authorId !== userId || existing.flightId !== input.flightId) {
        throw new ConflictError('This comment id is already used.', 'id_taken');
      }
      return { comment: await this.dto(existing), created: false };
    }
    this.notify(comment, flight.teamId, flight.pilotId, parent?.authorId ?? null, mentions);
    const names = mentions.length > 0 ? await this.names(mentions) : new Map<string, string>();
    names.set(userId, flight.userName);
    return { comment: this.toDto(comment, names), created: true };
  }

  /**
   * A comment with its flight as the user sees it. A comment on a flight the user cannot read is
   * "not found", so its id says nothing about other teams.
   */
  private async open(userId: string, id: string) {
    const comment = await this.repo.findOneBy({ id });
    if (!comment) throw new NotFoundError('Comment');
    const flight = await this.flights
      .access(userId, comment.flightId, 'team.read')
      .catch((err: unknown) => {
        throw err instanceof NotFoundError ? new NotFoundError('Comment') : err;
      });
    return { comment, flight };
  }

  /** `expected`: the version the editor saw (If-Match); a newer one answers 412. */
  async patch(
    userId: string,
    id: string,
    body: CommentPatch,
    expected?: number,
  ): Promise<CommentDto> {
    const input = CommentPatch.parse(body);
    const { comment, flight } = await this.open(userId, id);
    if (comment.deletedAt !== null) throw new ConflictError('This comment was deleted.', 'deleted');
    const changes: Partial<Comment> = {};
    let newMentions: string[] = [];
    if (input.body !== undefined || input.mentions !== undefined) {
      if (comment.authorId !== userId)
        throw new ForbiddenError('Only the author can edit a comment.');
      assertCan(
        flight.role,
        'comments.editOwn',
        'Your role in this team no longer allows editing.',
      );
      if (input.body !== undefined) changes.body = input.body;
      if (input.mentions !== undefined) {
        changes.mentions = await this.checkMentions(flight.teamId, input.mentions);
        newMentions = changes.mentions.filter((m) => !comment.mentions.includes(m));
      }
      changes.editedAt = Date.now();
    }
    if (input.resolved !== undefined) {
      if (comment.parentId !== null)
        throw new BadRequestError('Resolve or reopen the first comment of the thread.');
      const ownFlight = flight.pilotId === userId;
      if (
        !canOnRecord(flight.role, 'comments.resolveAny', 'comments.resolveOnOwnFlight', ownFlight)
      )
        throw new ForbiddenError('Your role cannot resolve comments on this flight.');
      changes.resolvedAt = input.resolved ? (comment.resolvedAt ?? Date.now()) : null;
      changes.resolvedById = input.resolved ? (comment.resolvedById ?? userId) : null;
    }
    if (expected !== undefined && expected !== comment.version)
      throw new VersionConflictError(comment.version, 'This comment');
    const done = await this.repo.update(
      { id, version: comment.version },
      { ...changes, version: comment.version + 1 },
    );
    if (!done.affected) {
      // Another write landed between our read and this one.
      const now = await this.repo.findOneByOrFail({ id });
      if (expected !== undefined) throw new VersionConflictError(now.version, 'This comment');
      return this.patch(userId, id, body);
    }
    if (input.resolved !== undefined) await this.refreshCounts(comment.flightId);
    const updated = { ...comment, ...changes, version: comment.version + 1 };
    if (newMentions.length > 0)
      this.notify(updated, flight.teamId, flight.pilotId, null, newMentions, true);
    return this.dto(updated);
  }

  /** Author deletes their own, the owner any. The thread keeps its place for the replies. */
  async remove(userId: string, id: string): Promise<void> {
    const { comment, flight } = await this.open(userId, id);
    const own = comment.authorId === userId;
    if (!canOnRecord(flight.role, 'comments.deleteAny', 'comments.deleteOwn', own)) {
      throw new ForbiddenError(
        'Only the author (while their role allows comments) or the team owner can delete a comment.',
      );
    }
    if (comment.deletedAt !== null) return;
    await this.repo.update({ id }, { deletedAt: Date.now(), body: '', mentions: [] });
    await this.refreshCounts(comment.flightId);
  }

  /**
   * One mail per person: a mention beats a reply, a reply beats "comment on your flight".
   * Comment and reply mail respect the user's preference; mentions go out up to the author's
   * hourly mention quota (the comment itself is always kept).
   */
  private notify(
    c: Comment,
    teamId: string,
    pilotId: string,
    parentAuthorId: string | null,
    mentions: string[],
    mentionsOnly = false,
  ) {
    const plan = new Map<string, CommentMailKind>();
    for (const m of mentions) plan.set(m, 'mention');
    if (!mentionsOnly) {
      if (parentAuthorId && !plan.has(parentAuthorId)) plan.set(parentAuthorId, 'reply');
      if (!plan.has(pilotId)) plan.set(pilotId, 'comment-on-flight');
    }
    plan.delete(c.authorId);
    if (plan.size === 0) return;
    this.mailer.track(
      (async () => {
        const ids = [...plan.keys(), c.authorId];
        // Membership and role as they are now, not when the comment was written: someone
        // removed from the team in between gets nothing about its flights.
        const users = await this.ds
          .getRepository(User)
          .createQueryBuilder('u')
          .innerJoin(Membership, 'm', 'm.userId = u.id AND m.teamId = :teamId', { teamId })
          .select([
            'u.id AS id',
            'u.email AS email',
            'u.name AS name',
            'u.commentMail AS "commentMail"',
            'm.role AS role',
          ])
          .where('u.id IN (:...ids)', { ids })
          .getRawMany<{
            id: string;
            email: string;
            name: string;
            commentMail: number;
            role: Role;
          }>();
        const byId = new Map(users.filter((u) => can(u.role, 'team.read')).map((u) => [u.id, u]));
        const f = await this.ds
          .getRepository(Flight)
          .createQueryBuilder('f')
          .innerJoin(Aircraft, 'a', 'a.id = f.aircraftId')
          .select(['a.name AS "aircraftName"', 'f.fileName AS "fileName"'])
          .where('f.id = :id', { id: c.flightId })
          .getRawOne<{ aircraftName: string; fileName: string }>();
        const author = byId.get(c.authorId)?.name ?? 'A team member';
        for (const [uid, kind] of plan) {
          const u = byId.get(uid);
          if (!u || (kind !== 'mention' && !u.commentMail)) continue;
          if (kind === 'mention' && !(await this.mentionQuota.take(c.authorId))) continue;
          this.mailer.queue(
            commentMail(this.config, {
              kind,
              to: u.email,
              author,
              flightName: f ? `${f.aircraftName} · ${f.fileName}` : 'a flight',
              flightId: c.flightId,
              commentId: c.id,
              tS: c.tS,
              body: c.body,
            }),
          );
        }
      })(),
    );
  }
}
