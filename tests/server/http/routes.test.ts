import { randomUUID } from 'node:crypto';
import express from 'express';
import type { User } from 'lucia';
import request from 'supertest';
import { beforeEach, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { ApiErrorBody } from '../../../shared/api/error';
import { IdParam } from '../../../shared/schemas/common';
import { errorHandler } from '../../../server/http/error-handler';
import { createRoute, deleteRoute, versionedWriteRoute } from '../../../server/http/routes';
import { VersionConflictError } from '../../../server/http/versions';

/** A body whose parse changes it, so the test sees that the service gets the parsed value. */
const Note = z.object({ text: z.string().trim().min(1) });

/**
 * The route helpers on a bare Express app: a header stands in for the session, and each service
 * call is recorded, so the tests see what reached the service and what never did.
 */
describe('route helpers', () => {
  let calls: unknown[][];
  let current: number;
  const app = express();
  app.use(express.json());
  app.use((req, _res, next) => {
    const id = req.headers['x-user'];
    req.auth = typeof id === 'string' ? { user: { id } as User, session: {} as never } : null;
    next();
  });
  app.post(
    '/things/:id',
    createRoute(IdParam, Note, async (userId, { id }, note) => {
      calls.push([userId, id, note]);
      return { id, ...note };
    }),
  );
  app.patch(
    '/things/:id',
    versionedWriteRoute(IdParam, Note, async (userId, { id }, note, expected) => {
      calls.push([userId, id, note, expected]);
      if (expected !== undefined && expected !== current)
        throw new VersionConflictError(current, 'That note');
      current += 1;
      return { id, ...note, version: current };
    }),
  );
  app.delete(
    '/things/:id',
    deleteRoute(IdParam, async (userId, { id }) => {
      calls.push([userId, id]);
    }),
  );
  app.use(errorHandler);

  const userId = 'u-1';
  const id = randomUUID();
  /** A signed-in PATCH of the note, with If-Match when given. */
  const edit = (text: string, ifMatch?: string) => {
    const r = request(app).patch(`/things/${id}`).set('x-user', userId);
    return (ifMatch ? r.set('if-match', ifMatch) : r).send({ text });
  };
  beforeEach(() => {
    calls = [];
    current = 4;
  });

  it('create answers 201 with what the service stored, from the parsed body', async () => {
    const res = await request(app)
      .post(`/things/${id}`)
      .set('x-user', userId)
      .send({ text: '  props changed  ' })
      .expect(201);
    expect(res.body).toEqual({ id, text: 'props changed' });
    expect(calls).toEqual([[userId, id, { text: 'props changed' }]]);
  });

  it('a versioned write passes If-Match to the service and answers the new version as ETag', async () => {
    const res = await edit('rebalanced', '"4"').expect(200);
    expect(res.body).toEqual({ id, text: 'rebalanced', version: 5 });
    expect(res.headers.etag).toBe('"5"');
    expect(calls).toEqual([[userId, id, { text: 'rebalanced' }, 4]]);
  });

  it('a versioned write without If-Match passes no expected version', async () => {
    const res = await edit('blind').expect(200);
    expect(res.headers.etag).toBe('"5"');
    expect(calls[0]?.[3]).toBeUndefined();
  });

  it('a stale versioned write answers 412 with the current version, as body and ETag', async () => {
    const res = await edit('late', '"3"').expect(412);
    expect(ApiErrorBody.parse(res.body).error).toMatchObject({
      code: 'version_conflict',
      currentVersion: 4,
    });
    expect(res.headers.etag).toBe('"4"');
  });

  it('delete answers 204 with an empty body', async () => {
    const res = await request(app).delete(`/things/${id}`).set('x-user', userId).expect(204);
    expect(res.text).toBe('');
    expect(calls).toEqual([[userId, id]]);
  });

  /** Each refusal in the order the routes check: session, path, body, If-Match. */
  const refusals: {
    name: string;
    status: number;
    code: string;
    /** Where the first zod issue points, telling a path refusal from a body one. */
    at?: string[];
    send: () => request.Test;
  }[] = [
    {
      name: 'no session, even with a bad id and body',
      status: 401,
      code: 'unauthenticated',
      send: () => request(app).patch('/things/nope').send({}),
    },
    {
      name: 'a malformed id, even with a bad body',
      status: 400,
      code: 'bad_request',
      at: ['id'],
      send: () => request(app).patch('/things/nope').set('x-user', userId).send({}),
    },
    {
      name: 'a body the schema refuses',
      status: 400,
      code: 'bad_request',
      at: ['text'],
      send: () => edit(' '),
    },
    {
      name: 'an If-Match that names no version',
      status: 400,
      code: 'bad_request',
      send: () => edit('ok', '"abc"'),
    },
    {
      name: 'create with no session',
      status: 401,
      code: 'unauthenticated',
      send: () => request(app).post(`/things/${id}`).send({ text: 'ok' }),
    },
    {
      name: 'create with a body the schema refuses',
      status: 400,
      code: 'bad_request',
      send: () => request(app).post(`/things/${id}`).set('x-user', userId).send({ text: 3 }),
    },
    {
      name: 'delete with a malformed id',
      status: 400,
      code: 'bad_request',
      send: () => request(app).delete('/things/nope').set('x-user', userId),
    },
  ];
  it.each(refusals)('refuses $name before the service runs', async ({ status, code, at, send }) => {
    const res = await send().expect(status);
    const error = ApiErrorBody.parse(res.body).error;
    expect(error.code).toBe(code);
    if (at) expect(error.issues?.[0]?.path).toEqual(at);
    expect(calls).toEqual([]);
  });
});
